import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import {
  MarkDeleteQuery,
  MarkParams,
  MarksExportQuery,
  MarksImportBody,
  MarkUpsertBody,
  TrackParams,
  type MarksResponse,
} from '../../shared/schemas/marking';
import { describeCsvErrors, formatMarksCsv, parseMarksCsv, type CsvLineError } from '../../shared/marking/marks-csv';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { currentTeam, currentUser, input } from '../http/input';
import { HttpProblem, badRequest, conflict } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { frameMatcher } from '../marking/frame-times';
import { loadMarkRows, markContext, markView } from '../marking/mark-views';
import { StaleMarkWrite, deleteMark, importMarks, upsertMark, type MarkValues } from '../marking/mark-writes';
import { loadTrack, type ClipScope } from '../marking/scope';

/**
 * Marks: one per (track, frame), saved as each is placed. Concurrency rules
 * (docs/marking-api.md): writes carry the revision the writer last saw; a
 * stale write to the same frame is a 409 with the stored mark, writes to
 * different frames never touch each other.
 */
export function markRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/tracks/:trackId/marks';
  api.get(base, 'Marks of a track with time and world position', signedIn, teamRole(CAN.read), validate({ params: TrackParams }), list);
  api.get(`${base}/export`, { summary: 'Marks of a track as CSV (frame,u_px,v_px or t_s,x_m,y_m)', produces: 'text/csv' }, signedIn, teamRole(CAN.read), validate({ params: TrackParams, query: MarksExportQuery }), exportCsv);
  api.post(`${base}/import`, 'Import marks from CSV, all or nothing', signedIn, teamRole(CAN.mark), validate({ params: TrackParams, body: MarksImportBody }), importCsv);
  api.put(`${base}/:frameNumber`, 'Place or move the mark on a frame (revision-checked)', signedIn, teamRole(CAN.mark), validate({ params: MarkParams, body: MarkUpsertBody }), put);
  api.delete(`${base}/:frameNumber`, 'Delete the mark on a frame (revision-checked)', signedIn, teamRole(CAN.mark), validate({ params: MarkParams, query: MarkDeleteQuery }), remove);

  function checkFrame(clip: ClipScope, frameNumber: number) {
    if (clip.frameCount > 0 && frameNumber >= clip.frameCount) {
      throw badRequest(`Frame ${frameNumber} is not in this clip (frames 0 to ${clip.frameCount - 1}).`, {
        errors: [{ path: 'params.frameNumber', message: `must be below ${clip.frameCount}` }],
      });
    }
  }

  async function staleProblem(err: StaleMarkWrite, clip: ClipScope, frameNumber: number): Promise<HttpProblem> {
    const ctx = await markContext(db, clip, [frameNumber]);
    const current = err.current ? markView(err.current.mark, err.current.updaterName, ctx) : null;
    const who = current?.updatedBy?.displayName ?? 'someone';
    const detail = current
      ? `Frame ${frameNumber} was marked or moved by ${who} since you loaded it; their mark is included.`
      : `The mark on frame ${frameNumber} was deleted since you loaded it.`;
    return conflict(detail, { current, trackRevision: err.trackRevision });
  }

  async function list(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackParams });
    const { track, clip } = await loadTrack(db, currentTeam(res).id, params.trackId);
    const [rows, ctx] = await Promise.all([loadMarkRows(db, track.id), markContext(db, clip)]);
    const body: MarksResponse = {
      trackId: track.id,
      trackRevision: track.revision,
      calibrationId: ctx.calibration?.id ?? null,
      calibrationVersion: ctx.calibration?.version ?? null,
      marks: rows.map((r) => markView(r.mark, r.updaterName, ctx)),
    };
    res.json(body);
  }

  async function put(_req: Request, res: Response) {
    const { params, body } = input(res, { params: MarkParams, body: MarkUpsertBody });
    const user = currentUser(res);
    const { track, clip } = await loadTrack(db, currentTeam(res).id, params.trackId);
    checkFrame(clip, params.frameNumber);
    const values: MarkValues = {
      uPx: body.uPx,
      vPx: body.vPx,
      placedUPx: body.placedUPx ?? body.uPx,
      placedVPx: body.placedVPx ?? body.vPx,
      snapped: body.snapped,
    };
    try {
      const written = await upsertMark(db, { trackId: track.id, frameNumber: params.frameNumber, values, expectedRevision: body.expectedRevision ?? null, userId: user.id });
      const ctx = await markContext(db, clip, [params.frameNumber]);
      res.json({ mark: markView(written.mark, user.displayName, ctx), trackRevision: written.trackRevision, created: written.created });
    } catch (err) {
      if (err instanceof StaleMarkWrite) throw await staleProblem(err, clip, params.frameNumber);
      throw err;
    }
  }

  async function remove(_req: Request, res: Response) {
    const { params, query } = input(res, { params: MarkParams, query: MarkDeleteQuery });
    const team = currentTeam(res);
    const user = currentUser(res);
    const { track, clip } = await loadTrack(db, team.id, params.trackId);
    try {
      const result = await deleteMark(db, { trackId: track.id, frameNumber: params.frameNumber, expectedRevision: query.expectedRevision });
      // A deleted mark is a person's work gone; keep what it was.
      await audit(db, {
        teamId: team.id,
        actorUserId: user.id,
        action: 'mark.delete',
        targetType: 'track',
        targetId: track.id,
        detail: { frameNumber: params.frameNumber, uPx: result.deleted.uPx, vPx: result.deleted.vPx, revision: result.deleted.revision },
      });
      res.json({ trackRevision: result.trackRevision });
    } catch (err) {
      if (err instanceof StaleMarkWrite) throw await staleProblem(err, clip, params.frameNumber);
      throw err;
    }
  }

  async function importCsv(_req: Request, res: Response) {
    const { params, body } = input(res, { params: TrackParams, body: MarksImportBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    const { track, clip } = await loadTrack(db, team.id, params.trackId);
    const rows = await rowsFromCsv(clip, body.csv, body.kind);
    const trackRevision = await db.transaction(async (tx) => {
      const revision = await importMarks(tx, { trackId: track.id, rows, replace: body.replace, userId: user.id });
      await audit(tx, { teamId: team.id, actorUserId: user.id, action: 'marks.import', targetType: 'track', targetId: track.id, detail: { kind: body.kind, count: rows.length, replace: body.replace } });
      return revision;
    });
    res.json({ imported: rows.length, trackRevision });
  }

  /** Parses and checks the whole file before anything is stored, so a bad line stores nothing. */
  async function rowsFromCsv(clip: ClipScope, csv: string, kind: 'pixel' | 'world'): Promise<(MarkValues & { frameNumber: number })[]> {
    const fail = (errors: CsvLineError[]) => {
      throw badRequest(`The CSV was not imported; nothing was stored. ${describeCsvErrors(errors)}`, {
        lineErrors: errors,
        errors: errors.map((e) => ({ path: `body.csv.line${e.line}`, message: e.message })),
      });
    };
    const placed = (frameNumber: number, u: number, v: number) => ({ frameNumber, uPx: u, vPx: v, placedUPx: u, placedVPx: v, snapped: false });
    const maxFrame = clip.frameCount > 0 ? clip.frameCount - 1 : Infinity;
    if (kind === 'pixel') {
      const parsed = parseMarksCsv(csv, 'pixel');
      if (!parsed.ok) return fail(parsed.errors);
      const errors: CsvLineError[] = [];
      parsed.rows.forEach((r, i) => {
        if (r.frame > maxFrame) errors.push({ line: parsed.lines[i], message: `frame ${r.frame} is after the clip's last frame (${maxFrame})` });
      });
      if (errors.length) return fail(errors);
      return parsed.rows.map((r) => placed(r.frame, r.uPx, r.vPx));
    }
    const parsed = parseMarksCsv(csv, 'world');
    if (!parsed.ok) return fail(parsed.errors);
    const ctx = await markContext(db, clip, []);
    if (!ctx.transform) {
      throw conflict('The clip is not calibrated, so world coordinates cannot be placed on its frames. Calibrate it first, or import a pixel file.');
    }
    const match = await frameMatcher(db, clip);
    const errors: CsvLineError[] = [];
    const out: (MarkValues & { frameNumber: number })[] = [];
    const seenFrames = new Map<number, number>();
    parsed.rows.forEach((r, i) => {
      const line = parsed.lines[i];
      const m = match(r.tS);
      if (m.frame === null) return void errors.push({ line, message: m.reason ?? 'no matching frame' });
      const earlier = seenFrames.get(m.frame);
      if (earlier !== undefined) return void errors.push({ line, message: `t_s ${r.tS} falls on frame ${m.frame}, already used on line ${earlier}` });
      seenFrames.set(m.frame, line);
      const p = ctx.transform!.worldToImage({ x: r.xM, y: r.yM });
      if (!Number.isFinite(p.u) || !Number.isFinite(p.v)) return void errors.push({ line, message: 'the point cannot be placed on the frame with this calibration' });
      out.push(placed(m.frame, p.u, p.v));
    });
    if (errors.length) return fail(errors);
    return out;
  }

  async function exportCsv(_req: Request, res: Response) {
    const { params, query } = input(res, { params: TrackParams, query: MarksExportQuery });
    const { track, clip } = await loadTrack(db, currentTeam(res).id, params.trackId);
    const [rows, ctx] = await Promise.all([loadMarkRows(db, track.id), markContext(db, clip)]);
    let csv: string;
    if (query.kind === 'pixel') {
      csv = formatMarksCsv(rows.map((r) => ({ frame: r.mark.frameNumber, uPx: r.mark.uPx, vPx: r.mark.vPx })), 'pixel');
    } else {
      if (!ctx.transform) throw conflict('The clip is not calibrated, so there are no world coordinates to export. Export pixels, or calibrate first.');
      const views = rows.map((r) => markView(r.mark, r.updaterName, ctx));
      csv = formatMarksCsv(views.filter((m) => m.tS !== null).map((m) => ({ tS: m.tS!, xM: m.xM!, yM: m.yM! })), 'world');
    }
    const safeName = track.name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'track';
    res.type('text/csv; charset=utf-8').attachment(`${safeName}-${query.kind}.csv`).send(csv);
  }
}
