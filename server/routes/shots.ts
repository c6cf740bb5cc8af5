import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { ShotPage, ShotResponse } from '../../shared/schemas/record-responses';
import { ShotCreateBody, ShotListQuery, ShotParams, ShotUpdateBody } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { createShot, deleteShot, getShot, listShots, updateShot } from '../records/shots';

/**
 * Shots: one firing each, with the conditions it was fired in, stored exactly
 * as given (SI; air density is derived from them later unless stated directly).
 */
/** A worked example for the API reference (invented ids and names). */
const SHOT_EXAMPLE = {
  request: { seriesId: '3f1c0a52-7d4e-4b8a-9c61-2e5d8f0b7a14', label: 'OL-40 shot 7', chamberPressurePa: 600000, elevationDeg: 45, airTempC: 18.5, stationPressurePa: 101200, relativeHumidityPct: 55, wind: { speedMps: 3, fromDeg: 200 }, launchHeightM: 1.1 },
  response: {
    id: '9a7e4c21-5b3d-4f60-8e12-7c4b9d0a3e58',
    seriesId: '3f1c0a52-7d4e-4b8a-9c61-2e5d8f0b7a14',
    seriesName: 'Wendlow Flats morning',
    launcherId: null,
    launcherName: null,
    projectileId: null,
    projectileName: null,
    label: 'OL-40 shot 7',
    chamberPressurePa: 600000,
    elevationDeg: 45,
    airTempC: 18.5,
    stationPressurePa: 101200,
    relativeHumidityPct: 55,
    tapeRangeM: null,
    wind: { speedMps: 3, fromDeg: 200 },
    launchHeightM: 1.1,
    airDensity: null,
    notes: null,
    createdAt: '2026-05-14T09:12:00.000Z',
    updatedAt: '2026-05-14T09:12:00.000Z',
    latestClip: null,
  },
};

export function shotRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/shots';
  api.get(base, { summary: 'List the team’s shots: paged, sorted and filtered on the server', response: ShotPage }, signedIn, teamRole(CAN.read), validate({ params: TeamParams, query: ShotListQuery }), list);
  api.post(base, { summary: 'Record a shot', status: 201, response: ShotResponse, example: SHOT_EXAMPLE }, signedIn, teamRole(CAN.editShots), validate({ params: TeamParams, body: ShotCreateBody }), create);
  api.get(`${base}/:shotId`, { summary: 'One shot with its conditions', response: ShotResponse }, signedIn, teamRole(CAN.read), validate({ params: ShotParams }), getOne);
  api.patch(`${base}/:shotId`, { summary: 'Change a shot', response: ShotResponse }, signedIn, teamRole(CAN.editShots), validate({ params: ShotParams, body: ShotUpdateBody }), update);
  api.delete(`${base}/:shotId`, { summary: 'Delete a shot that has no clips (409 otherwise)', status: 204 }, signedIn, teamRole(CAN.editShots), validate({ params: ShotParams }), remove);

  async function list(_req: Request, res: Response) {
    const { query } = input(res, { query: ShotListQuery });
    res.json(await listShots(db, currentTeam(res).id, query));
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotParams });
    res.json(await getShot(db, currentTeam(res).id, params.shotId));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: ShotCreateBody });
    res.status(201).json(await createShot(db, actorOf(res), body));
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ShotParams, body: ShotUpdateBody });
    res.json(await updateShot(db, actorOf(res), params.shotId, body));
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotParams });
    await deleteShot(db, actorOf(res), params.shotId);
    res.status(204).end();
  }
}
