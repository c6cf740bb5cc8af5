import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { SeriesList, SeriesResponse } from '../../shared/schemas/record-responses';
import { SeriesCreateBody, SeriesListQuery, SeriesParams, SeriesUpdateBody } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { createSeries, deleteSeries, getSeries, listSeries, updateSeries } from '../records/test-series';

/**
 * Test series: one day's (or session's) shots at a site.
 * Deleting a series that still has shots is refused with 409, so shot records
 * and their clips are never lost by a single click; delete or move the shots first.
 */
export function seriesRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/series';
  api.get(base, { summary: 'List the team’s test series (with shot counts)', response: SeriesList }, signedIn, teamRole(CAN.read), validate({ params: TeamParams, query: SeriesListQuery }), list);
  api.post(base, { summary: 'Create a test series', status: 201, response: SeriesResponse }, signedIn, teamRole(CAN.editShots), validate({ params: TeamParams, body: SeriesCreateBody }), create);
  api.get(`${base}/:seriesId`, { summary: 'One test series', response: SeriesResponse }, signedIn, teamRole(CAN.read), validate({ params: SeriesParams }), getOne);
  api.patch(`${base}/:seriesId`, { summary: 'Change a test series', response: SeriesResponse }, signedIn, teamRole(CAN.editShots), validate({ params: SeriesParams, body: SeriesUpdateBody }), update);
  api.delete(`${base}/:seriesId`, { summary: 'Delete a test series that has no shots (409 otherwise)', status: 204 }, signedIn, teamRole(CAN.editShots), validate({ params: SeriesParams }), remove);

  async function list(_req: Request, res: Response) {
    const { query } = input(res, { query: SeriesListQuery });
    res.json(await listSeries(db, currentTeam(res).id, query));
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: SeriesParams });
    res.json(await getSeries(db, currentTeam(res).id, params.seriesId));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: SeriesCreateBody });
    res.status(201).json(await createSeries(db, actorOf(res), body));
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: SeriesParams, body: SeriesUpdateBody });
    res.json(await updateSeries(db, actorOf(res), params.seriesId, body));
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: SeriesParams });
    await deleteSeries(db, actorOf(res), params.seriesId);
    res.status(204).end();
  }
}
