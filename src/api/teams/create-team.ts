import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { TeamCreateBody, TeamView } from '@shared/schemas/teams';
import { apiPost } from '@/lib/api-client';
import { invalidateAll } from '@/api/invalidate';
import { meKeys, teamKeys } from '@/api/query-keys';

export type CreateTeamInput = z.input<typeof TeamCreateBody>;

export function createTeam(body: CreateTeamInput): Promise<TeamView> {
  return apiPost<TeamView>('/api/teams', { ...body });
}

/** The creator becomes the team's admin, so "me" (my teams and roles) changes too. */
export function useCreateTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createTeam,
    onSuccess: () => invalidateAll(queryClient, [meKeys.me, teamKeys.all]),
  });
}
