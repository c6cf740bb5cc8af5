import type { ForecastBody } from '@shared/schemas/presets';

// Query keys of the presets area. Creating a preset or publishing a version
// invalidates `all(teamId)`: lists, history, forecasts and keep-out distances
// all depend on the latest version.
export const presetKeys = {
  all: (teamId: string) => ['presets', teamId] as const,
  list: (teamId: string) => [...presetKeys.all(teamId), 'list'] as const,
  detail: (teamId: string, presetId: string) => [...presetKeys.all(teamId), 'preset', presetId] as const,
  candidates: (teamId: string, presetId: string) => [...presetKeys.detail(teamId, presetId), 'candidates'] as const,
  keepOut: (teamId: string, presetId: string, version: number | undefined) => [...presetKeys.detail(teamId, presetId), 'keep-out', version ?? 'latest'] as const,
  measured: (teamId: string, presetId: string, version: number | undefined) => [...presetKeys.detail(teamId, presetId), 'measured', version ?? 'latest'] as const,
  forecast: (teamId: string, body: ForecastBody) => [...presetKeys.all(teamId), 'forecast', body] as const,
};

export const presetsPath = (teamId: string) => `/api/teams/${teamId}/presets`;
export const presetPath = (teamId: string, presetId: string) => `${presetsPath(teamId)}/${presetId}`;
