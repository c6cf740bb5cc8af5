import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AutoMarkBody, AutoMarkStarted } from '@shared/schemas/auto-mark';
import { apiPost } from '@/lib/api-client';
import { trackPath } from '@/api/api-paths';
import { autoMarkKeys } from './auto-mark-keys';

/** Starts marking a track automatically; the run is then polled (get-auto-mark-run). */
export function startAutoMark(teamId: string, trackId: string, body: AutoMarkBody = {}): Promise<AutoMarkStarted> {
  return apiPost<AutoMarkStarted>(trackPath(teamId, trackId, '/auto-mark'), body);
}

export function useStartAutoMark(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ trackId, body }: { trackId: string; body?: AutoMarkBody }) => startAutoMark(teamId, trackId, body),
    onSuccess: (_started, { trackId }) => client.invalidateQueries({ queryKey: autoMarkKeys.ofTrack(teamId, trackId) }),
  });
}
