// Limits checked before any frame is decoded, so one small, cleverly made file
// cannot expand into gigabytes of frame images (a 3.8 MB clip of 480 frames of
// 2048×2048 noise becomes about 1.1 GB of JPEGs), and one team cannot fill the
// disk everyone shares.
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { clipFrames, clips } from '../db/schema/clips';
import { HttpProblem } from '../http/problem';

export interface ExtractionLimits {
  /** frames × width × height of one extraction. */
  maxDecodedPixels: number;
  /** Bytes of clips and frames one team may keep. */
  teamStorageQuotaBytes: number;
}

const fmt = (n: number) => n.toLocaleString('en-US');

function formatBytes(bytes: number): string {
  const units: [number, string][] = [[1024 ** 4, 'TiB'], [1024 ** 3, 'GiB'], [1024 ** 2, 'MiB'], [1024, 'KiB']];
  for (const [size, unit] of units) if (bytes >= size) return `${Number((bytes / size).toFixed(1))} ${unit}`;
  return `${bytes} bytes`;
}

/** Throws 422 when the range would decode to more pixels than the cap allows. */
export function checkDecodedPixels(o: { frames: number; width: number; height: number; maxDecodedPixels: number }): void {
  const pixels = o.frames * o.width * o.height;
  if (pixels <= o.maxDecodedPixels) return;
  const fits = Math.max(0, Math.floor(o.maxDecodedPixels / (o.width * o.height)));
  throw new HttpProblem(
    422,
    'Too many pixels to extract',
    `Extracting ${fmt(o.frames)} frames of ${o.width}×${o.height} would decode ${fmt(pixels)} pixels; this server allows ${fmt(o.maxDecodedPixels)} per clip. Choose a range of at most ${fmt(fits)} frames (inFrame/outFrame) or upload a smaller clip.`,
    { decodedPixels: pixels, maxDecodedPixels: o.maxDecodedPixels, frames: o.frames, width: o.width, height: o.height, maxFrames: fits },
  );
}

/** Bytes a team keeps now: its clip files and their extracted frames. */
export async function teamStorageBytes(db: Db, teamId: string): Promise<number> {
  const [files] = await db.select({ n: sql<string>`coalesce(sum(${clips.sizeBytes}), 0)` }).from(clips).where(eq(clips.teamId, teamId));
  const [frames] = await db
    .select({ n: sql<string>`coalesce(sum(${clipFrames.sizeBytes}), 0)` })
    .from(clipFrames)
    .innerJoin(clips, eq(clips.id, clipFrames.clipId))
    .where(eq(clips.teamId, teamId));
  return Number(files.n) + Number(frames.n);
}

/** Throws 413 when adding `addBytes` would take the team over its quota. */
export async function checkTeamQuota(db: Db, teamId: string, addBytes: number, quotaBytes: number): Promise<void> {
  const used = await teamStorageBytes(db, teamId);
  if (used + addBytes <= quotaBytes) return;
  throw new HttpProblem(
    413,
    'Team storage full',
    `The team keeps ${formatBytes(used)} of clips and frames; this ${formatBytes(addBytes)} would take it over its quota of ${formatBytes(quotaBytes)}. Delete clips the team no longer needs, or ask the server's operator for a larger quota.`,
    { usedBytes: used, addBytes, quotaBytes },
  );
}
