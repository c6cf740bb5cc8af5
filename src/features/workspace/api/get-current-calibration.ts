import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CurrentCalibration } from '@shared/schemas/marking';
import { apiGet } from '@/lib/api-client';
import { clipBase, workspaceKeys } from './keys';

export const fetchCurrentCalibration = (teamId: string, clipId: string) =>
  apiGet<CurrentCalibration>(`${clipBase(teamId, clipId)}/calibrations/current`);

export const currentCalibrationQuery = (teamId: string, clipId: string) =>
  queryOptions({ queryKey: workspaceKeys.calibration(teamId, clipId), queryFn: () => fetchCurrentCalibration(teamId, clipId) });

export const useCurrentCalibration = (teamId: string, clipId: string) => useQuery(currentCalibrationQuery(teamId, clipId));
