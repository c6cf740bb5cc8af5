import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LensProfile, LensProfileUpdateBody } from '@shared/schemas/lens-profiles';
import { apiPatch } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { lensProfileKeys } from '@/api/query-keys';

export function updateLensProfile(teamId: string, profileId: string, body: LensProfileUpdateBody): Promise<LensProfile> {
  return apiPatch<LensProfile>(teamPath(teamId, `/lens-profiles/${profileId}`), body);
}

export function useUpdateLensProfile(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: LensProfileUpdateBody }) => updateLensProfile(teamId, id, body),
    // Calibrations that used the profile keep their copied coefficients: nothing else changes.
    onSuccess: () => client.invalidateQueries({ queryKey: lensProfileKeys.all(teamId) }),
  });
}
