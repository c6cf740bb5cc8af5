import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TeamSettings, TeamSettingsBody } from '@shared/schemas/team-settings';
import { apiPatch } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { teamSettingsKeys } from '@/api/query-keys';

export const updateTeamSettings = (teamId: string, body: TeamSettingsBody) => apiPatch<TeamSettings>(teamPath(teamId, '/settings'), body);

export function useUpdateTeamSettings(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: TeamSettingsBody) => updateTeamSettings(teamId, body),
    onSuccess: (settings) => qc.setQueryData(teamSettingsKeys.all(teamId), settings),
  });
}
