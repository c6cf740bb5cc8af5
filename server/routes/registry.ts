import type { AppDeps } from '../app-deps';
import type { RouteTable } from '../http/route-table';
import { authRoutes } from './auth';
import { healthRoutes } from './health';
import { openApiRoutes } from './openapi';

/** Each resource declares its routes in its own file; this is the order they are mounted. */
export function registerAllRoutes(api: RouteTable, deps: AppDeps): void {
  healthRoutes(api.section('health'), deps);
  openApiRoutes(api.section('meta'), deps);
  authRoutes(api.section('auth'), deps);
}
