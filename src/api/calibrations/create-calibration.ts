import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Calibration, CalibrationCreateBody } from '@shared/schemas/marking';
import { apiPost } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { invalidateAll } from '@/api/invalidate';
import { calibrationKeys, fitKeys, markKeys } from '@/api/query-keys';

export const createCalibration = (teamId: string, clipId: string, body: CalibrationCreateBody) =>
  apiPost<Calibration>(clipPath(teamId, clipId, '/calibrations'), body as unknown as Record<string, unknown>);

/** Saves the draft as the clip's next calibration version; world coordinates everywhere follow it. */
export function useCreateCalibration(teamId: string, clipId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CalibrationCreateBody) => createCalibration(teamId, clipId, body),
    onSuccess: (calibration) => {
      qc.setQueryData(calibrationKeys.current(teamId, clipId), { calibration });
      // The server's world x/y of every mark, and so every fit, follow the new version.
      return invalidateAll(qc, [calibrationKeys.current(teamId, clipId), markKeys.all(teamId), fitKeys.all(teamId)]);
    },
  });
}
