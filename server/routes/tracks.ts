import type { Request, Response } from 'express';
import { and, asc, count, eq } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { ClipParams, TrackCreateBody, TrackParams, TrackUpdateBody, type Track } from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { marks, tracks } from '../db/schema/marking';
import { currentTeam, currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { loadClip, loadTrack } from '../marking/scope';

/** Tracks: named series of marks on one clip (the projectile, or a muzzle point). */
export function trackRoutes(api: RouteTable, { db }: AppDeps) {
  const clipBase = '/api/teams/:teamId/clips/:clipId/tracks';
  const base = '/api/teams/:teamId/tracks/:trackId';
  api.get(clipBase, 'Tracks of a clip, oldest first', signedIn, teamRole(CAN.read), validate({ params: ClipParams }), list);
  api.post(clipBase, { summary: 'Start a track on a clip', status: 201 }, signedIn, teamRole(CAN.mark), validate({ params: ClipParams, body: TrackCreateBody }), create);
  api.get(base, 'One track', signedIn, teamRole(CAN.read), validate({ params: TrackParams }), getOne);
  api.patch(base, 'Rename a track or change its kind', signedIn, teamRole(CAN.mark), validate({ params: TrackParams, body: TrackUpdateBody }), update);
  api.delete(base, { summary: 'Delete a track and its marks', status: 204 }, signedIn, teamRole(CAN.mark), validate({ params: TrackParams }), remove);

  async function trackViews(where: ReturnType<typeof eq>): Promise<Track[]> {
    const rows = await db
      .select({ track: tracks, markCount: count(marks.frameNumber) })
      .from(tracks)
      .leftJoin(marks, eq(marks.trackId, tracks.id))
      .where(where)
      .groupBy(tracks.id)
      .orderBy(asc(tracks.createdAt), asc(tracks.id));
    return rows.map(({ track, markCount }) => ({
      id: track.id,
      clipId: track.clipId,
      teamId: track.teamId,
      name: track.name,
      kind: track.kind,
      revision: track.revision,
      markCount,
      createdAt: track.createdAt.toISOString(),
    }));
  }

  async function list(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipParams });
    const clip = await loadClip(db, currentTeam(res).id, params.clipId);
    res.json({ tracks: await trackViews(eq(tracks.clipId, clip.id)) });
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackParams });
    const { track } = await loadTrack(db, currentTeam(res).id, params.trackId);
    res.json((await trackViews(eq(tracks.id, track.id)))[0]);
  }

  async function create(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipParams, body: TrackCreateBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    const clip = await loadClip(db, team.id, params.clipId);
    const id = await db.transaction(async (tx) => {
      const [row] = await tx.insert(tracks).values({ clipId: clip.id, teamId: team.id, name: body.name, kind: body.kind, createdBy: user.id }).returning({ id: tracks.id });
      await audit(tx, { teamId: team.id, actorUserId: user.id, action: 'track.create', targetType: 'track', targetId: row.id, detail: { clipId: clip.id, name: body.name, kind: body.kind } });
      return row.id;
    });
    res.status(201).json((await trackViews(eq(tracks.id, id)))[0]);
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: TrackParams, body: TrackUpdateBody });
    const team = currentTeam(res);
    const { track } = await loadTrack(db, team.id, params.trackId);
    await db.transaction(async (tx) => {
      await tx.update(tracks).set(body).where(and(eq(tracks.id, track.id), eq(tracks.teamId, team.id)));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'track.update', targetType: 'track', targetId: track.id, detail: { fields: Object.keys(body) } });
    });
    res.json((await trackViews(eq(tracks.id, track.id)))[0]);
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackParams });
    const team = currentTeam(res);
    const { track } = await loadTrack(db, team.id, params.trackId);
    await db.transaction(async (tx) => {
      const [{ n }] = await tx.select({ n: count() }).from(marks).where(eq(marks.trackId, track.id));
      await tx.delete(tracks).where(eq(tracks.id, track.id));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'track.delete', targetType: 'track', targetId: track.id, detail: { clipId: track.clipId, name: track.name, markCount: n } });
    });
    res.status(204).end();
  }
}
