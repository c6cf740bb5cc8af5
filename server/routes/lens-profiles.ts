import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { LensProfile, LensProfileCreateBody, LensProfileList, LensProfileParams, LensProfileUpdateBody } from '../../shared/schemas/lens-profiles';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { lensProfileRecords } from '../records/lens-profiles';
import { teamRecordHandlers } from './team-record-handlers';

// The people who keep the kit records keep the lenses too; everyone reads them (a calibration may name one).
const EDIT_LENS_PROFILES = CAN.editEquipment;

/** Lens profiles the team measured once; a calibration copies the coefficients, so editing or deleting a profile changes no calibration. */
export function lensProfileRoutes(api: RouteTable, { db }: AppDeps) {
  const { list, create, getOne, update, remove } = teamRecordHandlers(lensProfileRecords(db), 'profileId');
  const base = '/api/teams/:teamId/lens-profiles';
  api.get(base, { summary: 'List the team’s lens profiles', response: LensProfileList }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), list);
  api.post(base, { summary: 'Add a lens profile (Brown–Conrady k1, k2 and the frame size they refer to)', status: 201, response: LensProfile }, signedIn, teamRole(EDIT_LENS_PROFILES), validate({ params: TeamParams, body: LensProfileCreateBody }), create);
  api.get(`${base}/:profileId`, { summary: 'One lens profile', response: LensProfile }, signedIn, teamRole(CAN.read), validate({ params: LensProfileParams }), getOne);
  api.patch(`${base}/:profileId`, { summary: 'Change a lens profile (calibrations that used it keep their copied coefficients)', response: LensProfile }, signedIn, teamRole(EDIT_LENS_PROFILES), validate({ params: LensProfileParams, body: LensProfileUpdateBody }), update);
  api.delete(`${base}/:profileId`, { summary: 'Delete a lens profile (calibrations that used it keep their copied coefficients)', status: 204 }, signedIn, teamRole(EDIT_LENS_PROFILES), validate({ params: LensProfileParams }), remove);
}
