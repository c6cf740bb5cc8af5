// Query keys of the workspace. Mutations invalidate by these, so a save in
// one panel refreshes every panel that shows the same data.
export const workspaceKeys = {
  all: ['workspace'] as const,
  me: () => [...workspaceKeys.all, 'me'] as const,
  clip: (teamId: string, clipId: string) => [...workspaceKeys.all, teamId, 'clip', clipId] as const,
  frames: (teamId: string, clipId: string) => [...workspaceKeys.clip(teamId, clipId), 'frames'] as const,
  calibration: (teamId: string, clipId: string) => [...workspaceKeys.clip(teamId, clipId), 'calibration'] as const,
  tracks: (teamId: string, clipId: string) => [...workspaceKeys.clip(teamId, clipId), 'tracks'] as const,
  marks: (teamId: string, trackId: string) => [...workspaceKeys.all, teamId, 'marks', trackId] as const,
};

export const clipBase = (teamId: string, clipId: string) => `/api/teams/${teamId}/clips/${clipId}`;
export const trackBase = (teamId: string, trackId: string) => `/api/teams/${teamId}/tracks/${trackId}`;

/** Frames are immutable once extracted, so the browser caches them for good. */
export const frameImageUrl = (teamId: string, clipId: string, frameNumber: number) =>
  `${clipBase(teamId, clipId)}/frames/${frameNumber}/image`;
