import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TeamSettings } from '@shared/schemas/team-settings';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { teamSettingsKeys } from '@/api/query-keys';

export const fetchTeamSettings = (teamId: string) => apiGet<TeamSettings>(teamPath(teamId, '/settings'));

export const teamSettingsQuery = (teamId: string) => queryOptions({ queryKey: teamSettingsKeys.all(teamId), queryFn: () => fetchTeamSettings(teamId) });

export const useTeamSettings = (teamId: string) => useQuery(teamSettingsQuery(teamId));
