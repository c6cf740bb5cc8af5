import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { LauncherList, LauncherResponse } from '../../shared/schemas/record-responses';
import { LauncherCreateBody, LauncherParams, LauncherUpdateBody } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { launcherRecords } from '../records/team-records';
import { teamRecordHandlers } from './team-record-handlers';

// Engineers maintain launchers as well as analysts: presets and keep-out distances depend on them.
const EDIT_LAUNCHERS = CAN.editEquipment;

/** Launchers the team fires. A launcher still named by shots cannot be deleted (409), so no shot silently loses it. */
export function launcherRoutes(api: RouteTable, { db }: AppDeps) {
  const { list, create, getOne, update, remove } = teamRecordHandlers(launcherRecords(db), 'launcherId');
  const base = '/api/teams/:teamId/launchers';
  api.get(base, { summary: 'List the team’s launchers', response: LauncherList }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), list);
  api.post(base, { summary: 'Add a launcher', status: 201, response: LauncherResponse }, signedIn, teamRole(EDIT_LAUNCHERS), validate({ params: TeamParams, body: LauncherCreateBody }), create);
  api.get(`${base}/:launcherId`, { summary: 'One launcher', response: LauncherResponse }, signedIn, teamRole(CAN.read), validate({ params: LauncherParams }), getOne);
  api.patch(`${base}/:launcherId`, { summary: 'Change a launcher', response: LauncherResponse }, signedIn, teamRole(EDIT_LAUNCHERS), validate({ params: LauncherParams, body: LauncherUpdateBody }), update);
  api.delete(`${base}/:launcherId`, { summary: 'Delete a launcher no shot uses (409 otherwise)', status: 204 }, signedIn, teamRole(EDIT_LAUNCHERS), validate({ params: LauncherParams }), remove);
}
