import type { QueryClient } from '@tanstack/react-query';
import { invalidateAll } from '@/api/invalidate';
import { fitKeys, launcherKeys, presetKeys, projectileKeys, seriesKeys, shotKeys } from '@/api/query-keys';

/**
 * Team records name each other: a renamed series or launcher shows in the shot
 * list, a shot's label and kit in its fits and the overview, the kit in the
 * presets. The lists are small, so any record write refreshes them all.
 */
export const invalidateRecordViews = (client: QueryClient, teamId: string) =>
  invalidateAll(client, [seriesKeys.all(teamId), shotKeys.all(teamId), launcherKeys.all(teamId), projectileKeys.all(teamId), fitKeys.all(teamId), presetKeys.all(teamId)]);
