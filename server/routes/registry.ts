import type { AppDeps } from '../app-deps';
import type { RouteTable } from '../http/route-table';
import { authRoutes } from './auth';
import { healthRoutes } from './health';
import { openApiRoutes } from './openapi';
import { teamRoutes } from './teams';
import { memberRoutes } from './members';
import { invitationRoutes } from './invitations';
import { outboxRoutes } from './outbox';
import { auditRoutes } from './audit';
import { seriesRoutes } from './series';
import { shotRoutes } from './shots';
import { launcherRoutes } from './launchers';
import { projectileRoutes } from './projectiles';
import { clipRoutes } from './clips';
import { calibrationRoutes } from './calibrations';
import { trackRoutes } from './tracks';
import { markRoutes } from './marks';
import { frameSnapRoutes } from './frame-snap';
import { fitRoutes } from './fits';
import { presetRoutes } from './presets';
import { autoMarkRoutes } from './auto-mark';

/** Each resource declares its routes in its own file; this is the order they are mounted. */
export function registerAllRoutes(api: RouteTable, deps: AppDeps): void {
  healthRoutes(api.section('health'), deps);
  openApiRoutes(api.section('meta'), deps);
  authRoutes(api.section('auth'), deps);
  teamRoutes(api.section('teams'), deps);
  memberRoutes(api.section('members'), deps);
  invitationRoutes(api.section('invitations'), deps);
  outboxRoutes(api.section('mail'), deps);
  auditRoutes(api.section('audit'), deps);
  seriesRoutes(api.section('series'), deps);
  shotRoutes(api.section('shots'), deps);
  launcherRoutes(api.section('launchers'), deps);
  projectileRoutes(api.section('projectiles'), deps);
  clipRoutes(api.section('clips'), deps);
  calibrationRoutes(api.section('calibrations'), deps);
  trackRoutes(api.section('tracks'), deps);
  markRoutes(api.section('marks'), deps);
  frameSnapRoutes(api.section('marks'), deps);
  autoMarkRoutes(api.section('auto-mark'), deps);
  fitRoutes(api.section('fits'), deps);
  presetRoutes(api.section('presets'), deps);
}
