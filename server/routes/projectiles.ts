import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { ProjectileList, ProjectileResponse } from '../../shared/schemas/record-responses';
import { ProjectileCreateBody, ProjectileParams, ProjectileUpdateBody } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { projectileRecords } from '../records/team-records';
import { teamRecordHandlers } from './team-record-handlers';

// Engineers maintain projectiles as well as analysts: presets and keep-out distances depend on them.
const EDIT_PROJECTILES = CAN.editEquipment;

/** Projectiles the team fires. A projectile still named by shots cannot be deleted (409), so no shot silently loses it. */
export function projectileRoutes(api: RouteTable, { db }: AppDeps) {
  const { list, create, getOne, update, remove } = teamRecordHandlers(projectileRecords(db), 'projectileId');
  const base = '/api/teams/:teamId/projectiles';
  api.get(base, { summary: 'List the team’s projectiles', response: ProjectileList }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), list);
  api.post(base, { summary: 'Add a projectile', status: 201, response: ProjectileResponse }, signedIn, teamRole(EDIT_PROJECTILES), validate({ params: TeamParams, body: ProjectileCreateBody }), create);
  api.get(`${base}/:projectileId`, { summary: 'One projectile', response: ProjectileResponse }, signedIn, teamRole(CAN.read), validate({ params: ProjectileParams }), getOne);
  api.patch(`${base}/:projectileId`, { summary: 'Change a projectile', response: ProjectileResponse }, signedIn, teamRole(EDIT_PROJECTILES), validate({ params: ProjectileParams, body: ProjectileUpdateBody }), update);
  api.delete(`${base}/:projectileId`, { summary: 'Delete a projectile no shot uses (409 otherwise)', status: 204 }, signedIn, teamRole(EDIT_PROJECTILES), validate({ params: ProjectileParams }), remove);
}
