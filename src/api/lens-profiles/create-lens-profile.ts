import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LensProfile, LensProfileCreateBody } from '@shared/schemas/lens-profiles';
import { apiPost } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { lensProfileKeys } from '@/api/query-keys';

export function createLensProfile(teamId: string, body: LensProfileCreateBody): Promise<LensProfile> {
  return apiPost<LensProfile>(teamPath(teamId, '/lens-profiles'), body);
}

export function useCreateLensProfile(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: LensProfileCreateBody) => createLensProfile(teamId, body),
    // Calibrations copy a profile's coefficients, so only the profile list changes.
    onSuccess: () => client.invalidateQueries({ queryKey: lensProfileKeys.all(teamId) }),
  });
}
