import type { QueryClient } from '@tanstack/react-query';
import { invalidateAll } from '@/api/invalidate';
import { calibrationKeys, clipKeys, fitKeys, markKeys, shotKeys, trackKeys } from '@/api/query-keys';

/** A clip's status and progress show on the clip pages and in the shot list. */
export const invalidateClipStatus = (client: QueryClient, teamId: string) => invalidateAll(client, [clipKeys.all(teamId), shotKeys.all(teamId)]);

/** When an extraction settles, the clip's frame list, its shot's clip list and the shot list are out of date. */
export const invalidateAfterExtraction = (client: QueryClient, teamId: string, clipId: string, shotId: string) =>
  invalidateAll(client, [clipKeys.frames(teamId, clipId), clipKeys.shotClips(teamId, shotId), shotKeys.all(teamId)]);

/**
 * New frames or a new clock change every frame time, so the marks' t/x/y and
 * every fit on the clip change with them; deleting a clip takes its tracks and
 * calibrations along.
 */
export const invalidateClipAndDerived = (client: QueryClient, teamId: string) =>
  invalidateAll(client, [clipKeys.all(teamId), shotKeys.all(teamId), calibrationKeys.all(teamId), trackKeys.all(teamId), markKeys.all(teamId), fitKeys.all(teamId)]);
