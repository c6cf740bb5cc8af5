import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { ClipParams, MarkingDoneBody, Track, TrackCreateBody, TrackList, TrackParams, TrackUpdateBody } from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { clipTracks, createTrack, deleteTrack, getTrack, updateTrack } from '../marking/tracks';
import { setMarkingDone } from '../marking/hand-offs';

/** Tracks: named series of marks on one clip (the projectile, or a muzzle point). */
export function trackRoutes(api: RouteTable, deps: AppDeps) {
  const { db } = deps;
  const clipBase = '/api/teams/:teamId/clips/:clipId/tracks';
  const base = '/api/teams/:teamId/tracks/:trackId';
  api.get(clipBase, { summary: 'Tracks of a clip, oldest first', response: TrackList }, signedIn, teamRole(CAN.read), validate({ params: ClipParams }), list);
  api.post(clipBase, { summary: 'Start a track on a clip', status: 201, response: Track }, signedIn, teamRole(CAN.mark), validate({ params: ClipParams, body: TrackCreateBody }), create);
  api.get(base, { summary: 'One track', response: Track }, signedIn, teamRole(CAN.read), validate({ params: TrackParams }), getOne);
  api.patch(base, { summary: 'Rename a track or change its kind', response: Track }, signedIn, teamRole(CAN.mark), validate({ params: TrackParams, body: TrackUpdateBody }), update);
  api.post(`${base}/marking-done`, { summary: 'Hand the track to the engineers (done: true) or take it back (done: false); engineers are told', response: Track }, signedIn, teamRole(CAN.mark), validate({ params: TrackParams, body: MarkingDoneBody }), markingDone);
  api.delete(base, { summary: 'Delete a track and its marks', status: 204 }, signedIn, teamRole(CAN.mark), validate({ params: TrackParams }), remove);

  async function list(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipParams });
    res.json({ tracks: await clipTracks(db, currentTeam(res).id, params.clipId) });
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackParams });
    res.json(await getTrack(db, currentTeam(res).id, params.trackId));
  }

  async function create(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipParams, body: TrackCreateBody });
    res.status(201).json(await createTrack(db, actorOf(res), params.clipId, body));
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: TrackParams, body: TrackUpdateBody });
    res.json(await updateTrack(db, actorOf(res), params.trackId, body));
  }

  async function markingDone(_req: Request, res: Response) {
    const { params, body } = input(res, { params: TrackParams, body: MarkingDoneBody });
    res.json(await setMarkingDone(deps, actorOf(res), params.trackId, body));
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackParams });
    await deleteTrack(db, actorOf(res), params.trackId);
    res.status(204).end();
  }
}
