import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Calibration, CalibrationCreateBody } from '@shared/schemas/marking';
import { apiPost } from '@/lib/api-client';
import { clipBase, workspaceKeys } from './keys';

export const createCalibration = (teamId: string, clipId: string, body: CalibrationCreateBody) =>
  apiPost<Calibration>(`${clipBase(teamId, clipId)}/calibrations`, body as unknown as Record<string, unknown>);

/** Saves the draft as the clip's next calibration version; world coordinates everywhere follow it. */
export function useCreateCalibration(teamId: string, clipId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CalibrationCreateBody) => createCalibration(teamId, clipId, body),
    onSuccess: (calibration) => {
      qc.setQueryData(workspaceKeys.calibration(teamId, clipId), { calibration });
      qc.invalidateQueries({ queryKey: workspaceKeys.calibration(teamId, clipId) });
    },
  });
}
