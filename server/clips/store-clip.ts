import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import type { FrameStampPosition } from '../../shared/physics/exposure-timing';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { analyseTimeBase } from '../media/time-base';
import { clipPrefix, type Storage } from '../storage/storage';
import type { InspectedClip } from './intake';

export interface NewClip {
  teamId: string;
  shotId: string;
  /**
   * Where the bytes are: a validated local file to move into storage (the demo
   * seed), or an upload already streamed into storage under its clip id.
   */
  file: string | { clipId: string; key: string };
  facts: InspectedClip;
  originalName: string;
  sha256: string;
  sizeBytes: number;
  captureFps: number;
  inFrame: number;
  outFrame: number;
  createdBy: string | null;
  /** Exposure timing, when stated (checked against the frame interval by the caller's schema). */
  shutterS?: number | null;
  frameStamp?: FrameStampPosition;
}

/**
 * Records a validated clip (status 'queued'), moving a local file into storage first, with
 * its time base and a note of any earlier clip of the team with the same bytes.
 * The row and its audit entry are one transaction; the file goes if they fail.
 */
export async function storeClip(db: Db, storage: Storage, c: NewClip): Promise<string> {
  const timeBase = analyseTimeBase({ ptsS: c.facts.ptsS, containerFps: c.facts.probe.containerFps, baseFps: c.facts.probe.baseFps, captureFps: c.captureFps });
  const [dup] = await db
    .select({ id: clips.id })
    .from(clips)
    .where(and(eq(clips.teamId, c.teamId), eq(clips.sha256, c.sha256)))
    .orderBy(asc(clips.createdAt))
    .limit(1);
  const clipId = typeof c.file === 'string' ? randomUUID() : c.file.clipId;
  const key = typeof c.file === 'string' ? `${clipPrefix(c.teamId, clipId)}original.${c.facts.container}` : c.file.key;
  if (typeof c.file === 'string') await storage.putFile(key, c.file);
  try {
    await db.transaction(async (tx) => {
      await tx.insert(clips).values({
        id: clipId,
        teamId: c.teamId,
        shotId: c.shotId,
        originalName: c.originalName,
        sha256: c.sha256,
        sizeBytes: c.sizeBytes,
        storageKey: key,
        formatName: c.facts.probe.formatName,
        codec: c.facts.probe.codec,
        width: c.facts.probe.width,
        height: c.facts.probe.height,
        rotationDeg: c.facts.probe.rotationDeg,
        containerFps: c.facts.probe.containerFps,
        captureFps: c.captureFps,
        baseFps: c.facts.probe.baseFps,
        frameCount: c.facts.frameCount,
        framePtsS: c.facts.ptsS,
        durationS: c.facts.probe.durationS,
        variableFrameRate: timeBase.variableFrameRate,
        timeBaseWarnings: timeBase.warnings,
        duplicateOfClipId: dup?.id ?? null,
        inFrame: c.inFrame,
        outFrame: c.outFrame,
        shutterS: c.shutterS ?? null,
        frameStamp: c.frameStamp ?? 'middle',
        status: 'queued',
        createdBy: c.createdBy,
      });
      await audit(tx, {
        teamId: c.teamId,
        actorUserId: c.createdBy,
        action: 'clip.upload',
        targetType: 'clip',
        targetId: clipId,
        detail: { shotId: c.shotId, originalName: c.originalName, sizeBytes: c.sizeBytes, sha256: c.sha256 },
      });
    });
  } catch (err) {
    await storage.deletePrefix(clipPrefix(c.teamId, clipId)).catch(() => {});
    throw err;
  }
  return clipId;
}
