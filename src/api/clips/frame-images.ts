import { clipPath } from '@/api/api-paths';

// Image URLs for <img> and the canvas: the server sends them with a strong ETag
// and immutable caching, so stepping back over frames costs no request. Pass
// `version` (the clip's updatedAt, which changes when it is re-extracted) where
// it is known, so a new frame set is never mixed with the old.

const versioned = (url: string, version: string | undefined) => (version === undefined ? url : `${url}?v=${encodeURIComponent(version)}`);

export function frameImageUrl(teamId: string, clipId: string, frameNumber: number, version?: string): string {
  return versioned(clipPath(teamId, clipId, `/frames/${frameNumber}/image`), version);
}

export function thumbnailImageUrl(teamId: string, clipId: string, n: number, version?: string): string {
  return versioned(clipPath(teamId, clipId, `/thumbnails/${n}/image`), version);
}
