// Query keys of the clips area; mutations invalidate by these.
export const clipKeys = {
  all: (teamId: string) => ['clips', teamId] as const,
  shotClips: (teamId: string, shotId: string) => [...clipKeys.all(teamId), 'shot', shotId] as const,
  clip: (teamId: string, clipId: string) => [...clipKeys.all(teamId), 'clip', clipId] as const,
  frames: (teamId: string, clipId: string) => [...clipKeys.clip(teamId, clipId), 'frames'] as const,
};

export const clipPath = (teamId: string, clipId: string, rest = '') => `/api/teams/${teamId}/clips/${clipId}${rest}`;
