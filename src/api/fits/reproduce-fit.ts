import { useMutation } from '@tanstack/react-query';
import type { ReproduceReport } from '@shared/schemas/fits';
import { apiPost } from '@/lib/api-client';
import { fitPath } from '@/api/api-paths';

export function reproduceFit(teamId: string, fitId: string): Promise<ReproduceReport> {
  return apiPost<ReproduceReport>(fitPath(teamId, fitId, '/reproduce'));
}

/** Changes nothing on the server, so there is nothing to invalidate. */
export function useReproduceFit(teamId: string, fitId: string) {
  return useMutation({ mutationFn: () => reproduceFit(teamId, fitId) });
}
