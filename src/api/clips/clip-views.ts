import type { QueryClient } from '@tanstack/react-query';
import { invalidateAll } from '@/api/invalidate';
import { calibrationKeys, clipKeys, fitKeys, markKeys, shotKeys, trackKeys } from '@/api/query-keys';

/** A clip's status and progress show on the clip pages and in the shot list. */
export const invalidateClipStatus = (client: QueryClient, teamId: string) => invalidateAll(client, [clipKeys.all(teamId), shotKeys.all(teamId)]);

/**
 * New frames or a new clock change every frame time, so the marks' t/x/y and
 * every fit on the clip change with them; deleting a clip takes its tracks and
 * calibrations along.
 */
export const invalidateClipAndDerived = (client: QueryClient, teamId: string) =>
  invalidateAll(client, [clipKeys.all(teamId), shotKeys.all(teamId), calibrationKeys.all(teamId), trackKeys.all(teamId), markKeys.all(teamId), fitKeys.all(teamId)]);
