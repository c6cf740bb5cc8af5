import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { lensProfileKeys } from '@/api/query-keys';

/** Calibrations that used the profile keep their copied coefficients. */
export function deleteLensProfile(teamId: string, profileId: string): Promise<void> {
  return apiDelete<void>(teamPath(teamId, `/lens-profiles/${profileId}`));
}

export function useDeleteLensProfile(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteLensProfile(teamId, id),
    onSuccess: () => client.invalidateQueries({ queryKey: lensProfileKeys.all(teamId) }),
  });
}
