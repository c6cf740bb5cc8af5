import type { QueryClient } from '@tanstack/react-query';
import { invalidateAll } from '@/api/invalidate';
import { fitKeys, presetKeys } from '@/api/query-keys';

/**
 * A fit's state and numbers show on the fit page, the shot's fit list and the
 * overview; approved fits are what a preset pools, so its candidates, pool
 * preview and measured-vs-forecast views change with them.
 */
export const invalidateFitViews = (client: QueryClient, teamId: string) => invalidateAll(client, [fitKeys.all(teamId), presetKeys.all(teamId)]);
