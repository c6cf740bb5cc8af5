import type { Request, Response } from 'express';
import { and, asc, count, desc, eq, ilike, or, sql } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { SeriesCreateBody, SeriesListQuery, SeriesParams, SeriesUpdateBody } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { shots, testSeries } from '../db/schema/records';
import { currentTeam, currentUser, input } from '../http/input';
import { conflict, notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { escapeLike } from '../db/escape-like';

/**
 * Test series: one day's (or session's) shots at a site.
 * Deleting a series that still has shots is refused with 409, so shot records
 * and their clips are never lost by a single click; delete or move the shots first.
 */
export function seriesRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/series';
  api.get(base, 'List the team’s test series (with shot counts)', signedIn, teamRole(CAN.read), validate({ params: TeamParams, query: SeriesListQuery }), list);
  api.post(base, { summary: 'Create a test series', status: 201 }, signedIn, teamRole(CAN.editShots), validate({ params: TeamParams, body: SeriesCreateBody }), create);
  api.get(`${base}/:seriesId`, 'One test series', signedIn, teamRole(CAN.read), validate({ params: SeriesParams }), getOne);
  api.patch(`${base}/:seriesId`, 'Change a test series', signedIn, teamRole(CAN.editShots), validate({ params: SeriesParams, body: SeriesUpdateBody }), update);
  api.delete(`${base}/:seriesId`, { summary: 'Delete a test series that has no shots (409 otherwise)', status: 204 }, signedIn, teamRole(CAN.editShots), validate({ params: SeriesParams }), remove);

  const shotCount = sql<number>`(select count(*)::int from ${shots} where ${shots.seriesId} = ${testSeries.id})`;
  const columns = {
    id: testSeries.id,
    name: testSeries.name,
    testDate: testSeries.testDate,
    site: testSeries.site,
    notes: testSeries.notes,
    createdAt: testSeries.createdAt,
    shotCount,
  };

  async function loadSeries(teamId: string, seriesId: string) {
    const [row] = await db.select(columns).from(testSeries).where(and(eq(testSeries.teamId, teamId), eq(testSeries.id, seriesId)));
    if (!row) throw notFound('No such test series in this team.');
    return row;
  }

  async function list(_req: Request, res: Response) {
    const { query } = input(res, { query: SeriesListQuery });
    const team = currentTeam(res);
    const order = query.dir === 'asc' ? asc : desc;
    const sortColumn = { date: testSeries.testDate, name: testSeries.name, created: testSeries.createdAt }[query.sort];
    const text = query.q ? `%${escapeLike(query.q)}%` : null;
    const rows = await db
      .select(columns)
      .from(testSeries)
      .where(and(eq(testSeries.teamId, team.id), text ? or(ilike(testSeries.name, text), ilike(testSeries.site, text)) : undefined))
      .orderBy(order(sortColumn), order(testSeries.createdAt));
    res.json(rows);
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: SeriesParams });
    res.json(await loadSeries(currentTeam(res).id, params.seriesId));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: SeriesCreateBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    const id = await db.transaction(async (tx) => {
      const [row] = await tx.insert(testSeries).values({ ...body, teamId: team.id, createdBy: user.id }).returning({ id: testSeries.id });
      await audit(tx, { teamId: team.id, actorUserId: user.id, action: 'series.create', targetType: 'series', targetId: row.id, detail: { name: body.name } });
      return row.id;
    });
    res.status(201).json(await loadSeries(team.id, id));
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: SeriesParams, body: SeriesUpdateBody });
    const team = currentTeam(res);
    await loadSeries(team.id, params.seriesId);
    await db.transaction(async (tx) => {
      await tx.update(testSeries).set(body).where(and(eq(testSeries.teamId, team.id), eq(testSeries.id, params.seriesId)));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'series.update', targetType: 'series', targetId: params.seriesId, detail: { fields: Object.keys(body) } });
    });
    res.json(await loadSeries(team.id, params.seriesId));
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: SeriesParams });
    const team = currentTeam(res);
    const series = await loadSeries(team.id, params.seriesId);
    await db.transaction(async (tx) => {
      // Counted inside the transaction with the row locked, so a shot created meanwhile cannot be cascaded away.
      await tx.select({ id: testSeries.id }).from(testSeries).where(eq(testSeries.id, params.seriesId)).for('update');
      const [{ n }] = await tx.select({ n: count() }).from(shots).where(eq(shots.seriesId, params.seriesId));
      if (n > 0) {
        throw conflict(`The series “${series.name}” still has ${n} shot${n === 1 ? '' : 's'}. Delete or move them to another series first.`, { shotCount: n });
      }
      await tx.delete(testSeries).where(eq(testSeries.id, params.seriesId));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'series.delete', targetType: 'series', targetId: params.seriesId, detail: { name: series.name } });
    });
    res.status(204).end();
  }
}
