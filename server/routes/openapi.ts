import type { AppDeps } from '../app-deps';
import { OpenApiDocumentShape } from '../../shared/schemas/system-responses';
import { open } from '../auth/access';
import type { RouteTable } from '../http/route-table';

// Served by app.ts once the table is complete; declared here so it is listed too.
export function openApiRoutes(api: RouteTable, _deps: AppDeps) {
  api.get('/api/openapi.json', { summary: 'This OpenAPI 3.1 document', response: OpenApiDocumentShape }, open, (_req, _res, next) => next());
}
