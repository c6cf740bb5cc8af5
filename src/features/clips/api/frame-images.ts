import { clipPath } from './keys';

// Image URLs for <img>: the server sends them with a strong ETag and immutable
// caching, so stepping back over frames costs no request. `version` changes when
// the clip is re-extracted (updatedAt), so a new frame set is never mixed with the old.

export function frameImageUrl(teamId: string, clipId: string, frameNumber: number, version: string): string {
  return `${clipPath(teamId, clipId, `/frames/${frameNumber}/image`)}?v=${encodeURIComponent(version)}`;
}

export function thumbnailImageUrl(teamId: string, clipId: string, n: number, version: string): string {
  return `${clipPath(teamId, clipId, `/thumbnails/${n}/image`)}?v=${encodeURIComponent(version)}`;
}
