import type { z } from 'zod';
import { describeCsvErrors, formatMarksCsv, parseMarksCsv, type CsvLineError } from '../../shared/marking/marks-csv';
import type { MarkUpsertBody, MarksImportBody, MarksResponse } from '../../shared/schemas/marking';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { HttpProblem, badRequest, conflict } from '../http/problem';
import { frameMatcher } from './frame-times';
import { loadMarkRows, markContext, markView } from './mark-views';
import { StaleMarkWrite, deleteMark, importMarks, upsertMark, type MarkValues } from './mark-writes';
import { loadTrack, type ClipScope } from './scope';

// Marks: one per (track, frame), saved as each is placed. Concurrency rules
// (docs/marking-api.md): writes carry the revision the writer last saw; a
// stale write to the same frame is a 409 with the stored mark, writes to
// different frames never touch each other.

/** A person writing marks: the actor plus the name their marks show. */
export interface Marker extends Actor {
  displayName: string;
}

function checkFrame(clip: ClipScope, frameNumber: number) {
  if (clip.frameCount > 0 && frameNumber >= clip.frameCount) {
    throw badRequest(`Frame ${frameNumber} is not in this clip (frames 0 to ${clip.frameCount - 1}).`, {
      errors: [{ path: 'params.frameNumber', message: `must be below ${clip.frameCount}` }],
    });
  }
}

async function staleProblem(db: Db, err: StaleMarkWrite, clip: ClipScope, frameNumber: number): Promise<HttpProblem> {
  const ctx = await markContext(db, clip, [frameNumber]);
  const current = err.current ? markView(err.current.mark, err.current.updaterName, ctx) : null;
  const who = current?.updatedBy?.displayName ?? 'someone';
  const detail = current
    ? `Frame ${frameNumber} was marked or moved by ${who} since you loaded it; their mark is included.`
    : `The mark on frame ${frameNumber} was deleted since you loaded it.`;
  return conflict(detail, { current, trackRevision: err.trackRevision });
}

/** Marks of a track with time and world position. */
export async function trackMarks(db: Db, teamId: string, trackId: string): Promise<MarksResponse> {
  const { track, clip } = await loadTrack(db, teamId, trackId);
  const [rows, ctx] = await Promise.all([loadMarkRows(db, track.id), markContext(db, clip)]);
  return {
    trackId: track.id,
    trackRevision: track.revision,
    calibrationId: ctx.calibration?.id ?? null,
    calibrationVersion: ctx.calibration?.version ?? null,
    marks: rows.map((r) => markView(r.mark, r.updaterName, ctx)),
  };
}

/** Places or moves the mark on a frame; a stale expected revision is a 409 carrying the stored mark. */
export async function putMark(db: Db, marker: Marker, trackId: string, frameNumber: number, body: z.output<typeof MarkUpsertBody>) {
  const { track, clip } = await loadTrack(db, marker.teamId, trackId);
  checkFrame(clip, frameNumber);
  const values: MarkValues = {
    uPx: body.uPx,
    vPx: body.vPx,
    placedUPx: body.placedUPx ?? body.uPx,
    placedVPx: body.placedVPx ?? body.vPx,
    snapped: body.snapped,
  };
  try {
    const written = await upsertMark(db, { trackId: track.id, frameNumber, values, expectedRevision: body.expectedRevision ?? null, userId: marker.userId });
    const ctx = await markContext(db, clip, [frameNumber]);
    return { mark: markView(written.mark, marker.displayName, ctx), trackRevision: written.trackRevision, created: written.created };
  } catch (err) {
    if (err instanceof StaleMarkWrite) throw await staleProblem(db, err, clip, frameNumber);
    throw err;
  }
}

/** Deletes the mark on a frame (revision-checked) and keeps what it was in the audit log. */
export async function removeMark(db: Db, actor: Actor, trackId: string, frameNumber: number, expectedRevision: number) {
  const { track, clip } = await loadTrack(db, actor.teamId, trackId);
  try {
    const result = await deleteMark(db, { trackId: track.id, frameNumber, expectedRevision });
    // A deleted mark is a person's work gone; keep what it was.
    await audit(db, {
      teamId: actor.teamId,
      actorUserId: actor.userId,
      action: 'mark.delete',
      targetType: 'track',
      targetId: track.id,
      detail: { frameNumber, uPx: result.deleted.uPx, vPx: result.deleted.vPx, revision: result.deleted.revision },
    });
    return { trackRevision: result.trackRevision };
  } catch (err) {
    if (err instanceof StaleMarkWrite) throw await staleProblem(db, err, clip, frameNumber);
    throw err;
  }
}

/** Imports marks from CSV, all or nothing. */
export async function importMarksCsv(db: Db, actor: Actor, trackId: string, body: z.output<typeof MarksImportBody>) {
  const { track, clip } = await loadTrack(db, actor.teamId, trackId);
  const rows = await rowsFromCsv(db, clip, body.csv, body.kind);
  const trackRevision = await db.transaction(async (tx) => {
    const revision = await importMarks(tx, { trackId: track.id, rows, replace: body.replace, userId: actor.userId });
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'marks.import', targetType: 'track', targetId: track.id, detail: { kind: body.kind, count: rows.length, replace: body.replace } });
    return revision;
  });
  return { imported: rows.length, trackRevision };
}

/** Parses and checks the whole file before anything is stored, so a bad line stores nothing. */
async function rowsFromCsv(db: Db, clip: ClipScope, csv: string, kind: 'pixel' | 'world'): Promise<(MarkValues & { frameNumber: number })[]> {
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

/** The track's marks as CSV (frame,u_px,v_px or t_s,x_m,y_m) with a file name made from the track's name. */
export async function exportMarksCsv(db: Db, teamId: string, trackId: string, kind: 'pixel' | 'world'): Promise<{ fileName: string; csv: string }> {
  const { track, clip } = await loadTrack(db, teamId, trackId);
  const [rows, ctx] = await Promise.all([loadMarkRows(db, track.id), markContext(db, clip)]);
  let csv: string;
  if (kind === 'pixel') {
    csv = formatMarksCsv(rows.map((r) => ({ frame: r.mark.frameNumber, uPx: r.mark.uPx, vPx: r.mark.vPx })), 'pixel');
  } else {
    if (!ctx.transform) throw conflict('The clip is not calibrated, so there are no world coordinates to export. Export pixels, or calibrate first.');
    const views = rows.map((r) => markView(r.mark, r.updaterName, ctx));
    csv = formatMarksCsv(views.filter((m) => m.tS !== null).map((m) => ({ tS: m.tS!, xM: m.xM!, yM: m.yM! })), 'world');
  }
  const safeName = track.name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'track';
  return { fileName: `${safeName}-${kind}.csv`, csv };
}
