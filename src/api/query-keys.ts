import type { ShotOverviewQuery } from '@shared/schemas/fits';
import type { ForecastBody } from '@shared/schemas/presets';
import type { ShotListQuery } from '@shared/schemas/records';

// The one query-key scheme of the client. Everything a team owns lives under
// ['teams', teamId, resource, …] (resource as in server/routes/<resource>.ts),
// so a mutation invalidates a whole resource with one prefix. What belongs to
// the signed-in person (me, my mail) lives under ['me', …]; the only other key
// is an invitation looked up by its token before anyone is signed in.

const team = (teamId: string) => ['teams', teamId] as const;

export const meKeys = {
  me: ['me'] as const,
};

export const mailKeys = {
  all: () => ['me', 'mail'] as const,
  page: (page: number, pageSize: number) => ['me', 'mail', 'page', { page, pageSize }] as const,
  message: (messageId: string) => ['me', 'mail', 'message', messageId] as const,
};

export const teamKeys = {
  all: ['teams'] as const,
  detail: (teamId: string) => [...team(teamId), 'team'] as const,
};

export const teamSettingsKeys = {
  all: (teamId: string) => [...team(teamId), 'settings'] as const,
};

export const workQueueKeys = {
  all: (teamId: string) => [...team(teamId), 'work-queues'] as const,
};

export const memberKeys = {
  all: (teamId: string) => [...team(teamId), 'members'] as const,
};

export const invitationKeys = {
  all: (teamId: string) => [...team(teamId), 'invitations'] as const,
  byToken: (token: string) => ['invitations', 'by-token', token] as const,
};

export const outboxKeys = {
  all: (teamId: string) => [...team(teamId), 'outbox'] as const,
  page: (teamId: string, page: number, pageSize: number) => [...outboxKeys.all(teamId), { page, pageSize }] as const,
};

export const seriesKeys = {
  all: (teamId: string) => [...team(teamId), 'series'] as const,
  list: (teamId: string) => [...seriesKeys.all(teamId), 'list'] as const,
};

export const shotKeys = {
  all: (teamId: string) => [...team(teamId), 'shots'] as const,
  list: (teamId: string, query: ShotListQuery) => [...shotKeys.all(teamId), 'list', query] as const,
  one: (teamId: string, shotId: string) => [...shotKeys.all(teamId), shotId] as const,
};

export const launcherKeys = {
  all: (teamId: string) => [...team(teamId), 'launchers'] as const,
};

export const projectileKeys = {
  all: (teamId: string) => [...team(teamId), 'projectiles'] as const,
};

export const lensProfileKeys = {
  all: (teamId: string) => [...team(teamId), 'lens-profiles'] as const,
};

export const clipKeys = {
  all: (teamId: string) => [...team(teamId), 'clips'] as const,
  shotClips: (teamId: string, shotId: string) => [...clipKeys.all(teamId), 'shot', shotId] as const,
  clip: (teamId: string, clipId: string) => [...clipKeys.all(teamId), clipId] as const,
  frames: (teamId: string, clipId: string) => [...clipKeys.clip(teamId, clipId), 'frames'] as const,
};

export const calibrationKeys = {
  all: (teamId: string) => [...team(teamId), 'calibrations'] as const,
  current: (teamId: string, clipId: string) => [...calibrationKeys.all(teamId), 'clip', clipId, 'current'] as const,
};

export const trackKeys = {
  all: (teamId: string) => [...team(teamId), 'tracks'] as const,
  ofClip: (teamId: string, clipId: string) => [...trackKeys.all(teamId), 'clip', clipId] as const,
};

export const markKeys = {
  all: (teamId: string) => [...team(teamId), 'marks'] as const,
  ofTrack: (teamId: string, trackId: string) => [...markKeys.all(teamId), 'track', trackId] as const,
};

export const fitKeys = {
  all: (teamId: string) => [...team(teamId), 'fits'] as const,
  fit: (teamId: string, fitId: string) => [...fitKeys.all(teamId), fitId] as const,
  shotFits: (teamId: string, shotId: string) => [...fitKeys.all(teamId), 'shot', shotId] as const,
  overview: (teamId: string, query: ShotOverviewQuery) => [...fitKeys.all(teamId), 'overview', query] as const,
  presetComparisons: (teamId: string, fitId: string) => [...fitKeys.fit(teamId, fitId), 'preset-comparisons'] as const,
};

export const presetKeys = {
  all: (teamId: string) => [...team(teamId), 'presets'] as const,
  list: (teamId: string) => [...presetKeys.all(teamId), 'list'] as const,
  detail: (teamId: string, presetId: string) => [...presetKeys.all(teamId), presetId] as const,
  candidates: (teamId: string, presetId: string) => [...presetKeys.detail(teamId, presetId), 'candidates'] as const,
  poolPreview: (teamId: string, presetId: string, fitIds: readonly string[]) => [...presetKeys.detail(teamId, presetId), 'pool-preview', fitIds] as const,
  keepOut: (teamId: string, presetId: string, version: number | undefined) => [...presetKeys.detail(teamId, presetId), 'keep-out', version ?? 'latest'] as const,
  measured: (teamId: string, presetId: string, version: number | undefined) => [...presetKeys.detail(teamId, presetId), 'measured', version ?? 'latest'] as const,
  forecast: (teamId: string, body: ForecastBody) => [...presetKeys.all(teamId), 'forecast', body] as const,
};
