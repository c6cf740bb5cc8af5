// URL builders shared by the endpoint files of several resources.
export const teamPath = (teamId: string, rest = '') => `/api/teams/${teamId}${rest}`;
export const clipPath = (teamId: string, clipId: string, rest = '') => teamPath(teamId, `/clips/${clipId}${rest}`);
export const trackPath = (teamId: string, trackId: string, rest = '') => teamPath(teamId, `/tracks/${trackId}${rest}`);
export const fitPath = (teamId: string, fitId: string, rest = '') => teamPath(teamId, `/fits/${fitId}${rest}`);
export const presetsPath = (teamId: string) => teamPath(teamId, '/presets');
export const presetPath = (teamId: string, presetId: string, rest = '') => `${presetsPath(teamId)}/${presetId}${rest}`;
