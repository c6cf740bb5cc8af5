import type { ShotOverviewQuery } from '@shared/schemas/fits';

// Query keys of the fits area. Running or reviewing a fit invalidates
// `all(teamId)`: the fit page, the shot's fit list and the overview all show
// the same states and numbers.
export const fitKeys = {
  all: (teamId: string) => ['fits', teamId] as const,
  fit: (teamId: string, fitId: string) => [...fitKeys.all(teamId), 'fit', fitId] as const,
  shotFits: (teamId: string, shotId: string) => [...fitKeys.all(teamId), 'shot', shotId] as const,
  overview: (teamId: string, query: ShotOverviewQuery) => [...fitKeys.all(teamId), 'overview', query] as const,
  // Presets belong to another area; the fit page only reads them, under its own keys.
  presets: (teamId: string) => [...fitKeys.all(teamId), 'presets'] as const,
  forecast: (teamId: string, body: object) => [...fitKeys.all(teamId), 'forecast', body] as const,
  presetComparisons: (teamId: string, fitId: string) => [...fitKeys.fit(teamId, fitId), 'preset-comparisons'] as const,
};

export const fitPath = (teamId: string, fitId: string) => `/api/teams/${teamId}/fits/${fitId}`;

/** Frames are served by the clip API; the overlay only needs the image URL. */
export const frameImageUrl = (teamId: string, clipId: string, frameNumber: number) =>
  `/api/teams/${teamId}/clips/${clipId}/frames/${frameNumber}/image`;
