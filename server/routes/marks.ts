import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import {
  MarkDeleteQuery,
  MarkDeleteResult,
  MarkParams,
  MarksImportResult,
  MarksResponse,
  MarkWriteResult,
  MarksExportQuery,
  MarksImportBody,
  MarkUpsertBody,
  TrackParams,
} from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { MARK_PUT_EXAMPLE } from '../http/api-examples';
import { exportMarksCsv, importMarksCsv, putMark, removeMark, trackMarks } from '../marking/marks';

/** Marks: one per (track, frame), saved as each is placed; the concurrency rules live in server/marking/marks.ts (docs/marking-api.md). */
export function markRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/tracks/:trackId/marks';
  api.get(base, { summary: 'Marks of a track with time and world position', response: MarksResponse }, signedIn, teamRole(CAN.read), validate({ params: TrackParams }), list);
  api.get(`${base}/export`, { summary: 'Marks of a track as CSV (frame,u_px,v_px or t_s,x_m,y_m)', produces: 'text/csv' }, signedIn, teamRole(CAN.read), validate({ params: TrackParams, query: MarksExportQuery }), exportCsv);
  api.post(`${base}/import`, { summary: 'Import marks from CSV, all or nothing', response: MarksImportResult }, signedIn, teamRole(CAN.mark), validate({ params: TrackParams, body: MarksImportBody }), importCsv);
  api.put(`${base}/:frameNumber`, { summary: 'Place or move the mark on a frame (revision-checked)', response: MarkWriteResult, example: MARK_PUT_EXAMPLE }, signedIn, teamRole(CAN.mark), validate({ params: MarkParams, body: MarkUpsertBody }), put);
  api.delete(`${base}/:frameNumber`, { summary: 'Delete the mark on a frame (revision-checked)', response: MarkDeleteResult }, signedIn, teamRole(CAN.mark), validate({ params: MarkParams, query: MarkDeleteQuery }), remove);

  async function list(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackParams });
    res.json(await trackMarks(db, currentTeam(res).id, params.trackId));
  }

  async function put(_req: Request, res: Response) {
    const { params, body } = input(res, { params: MarkParams, body: MarkUpsertBody });
    const marker = { ...actorOf(res), displayName: currentUser(res).displayName };
    res.json(await putMark(db, marker, params.trackId, params.frameNumber, body));
  }

  async function remove(_req: Request, res: Response) {
    const { params, query } = input(res, { params: MarkParams, query: MarkDeleteQuery });
    res.json(await removeMark(db, actorOf(res), params.trackId, params.frameNumber, query.expectedRevision));
  }

  async function importCsv(_req: Request, res: Response) {
    const { params, body } = input(res, { params: TrackParams, body: MarksImportBody });
    res.json(await importMarksCsv(db, actorOf(res), params.trackId, body));
  }

  async function exportCsv(_req: Request, res: Response) {
    const { params, query } = input(res, { params: TrackParams, query: MarksExportQuery });
    const { fileName, csv } = await exportMarksCsv(db, currentTeam(res).id, params.trackId, query.kind);
    res.type('text/csv; charset=utf-8').attachment(fileName).send(csv);
  }
}
