import { queryOptions, useQuery } from '@tanstack/react-query';
import { DEFAULT_REVIEW_THRESHOLD, type AutoMarkSettings } from '@shared/schemas/auto-mark';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { autoMarkKeys } from './auto-mark-keys';

export function fetchAutoMarkSettings(teamId: string): Promise<AutoMarkSettings> {
  return apiGet<AutoMarkSettings>(teamPath(teamId, '/auto-mark-settings'));
}

export const autoMarkSettingsQuery = (teamId: string) =>
  queryOptions({ queryKey: autoMarkKeys.settings(teamId), queryFn: () => fetchAutoMarkSettings(teamId), staleTime: 60_000 });

/** The team's review threshold (the default until it has loaded). */
export function useReviewThreshold(teamId: string): number {
  return useQuery(autoMarkSettingsQuery(teamId)).data?.reviewThreshold ?? DEFAULT_REVIEW_THRESHOLD;
}
