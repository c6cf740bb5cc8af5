import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CurrentCalibration } from '@shared/schemas/marking';
import { apiGet } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { calibrationKeys } from '@/api/query-keys';

export const fetchCurrentCalibration = (teamId: string, clipId: string) =>
  apiGet<CurrentCalibration>(clipPath(teamId, clipId, '/calibrations/current'));

export const currentCalibrationQuery = (teamId: string, clipId: string) =>
  queryOptions({ queryKey: calibrationKeys.current(teamId, clipId), queryFn: () => fetchCurrentCalibration(teamId, clipId) });

export const useCurrentCalibration = (teamId: string, clipId: string) => useQuery(currentCalibrationQuery(teamId, clipId));
