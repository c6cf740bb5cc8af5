import { and, eq, getTableColumns } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { midExposureShiftS } from '../../shared/physics/exposure-timing';
import type { ClipView } from '../../shared/schemas/clips';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';

type ClipRow = Omit<typeof clips.$inferSelect, 'framePtsS'>;

// Everything but the per-frame timestamps, which can run to a megabyte on long clips.
const { framePtsS: _pts, ...viewColumns } = getTableColumns(clips);

const duplicate = alias(clips, 'duplicate');

export function toClipView(row: ClipRow, duplicateOf: ClipView['duplicateOf']): ClipView {
  const turned = row.rotationDeg === 90 || row.rotationDeg === 270;
  const warnings = [...row.timeBaseWarnings];
  if (duplicateOf) {
    warnings.push({
      code: 'duplicate-upload',
      message: `The same file (identical SHA-256) was already uploaded as ${duplicateOf.originalName}.`,
    });
  }
  return {
    id: row.id,
    teamId: row.teamId,
    shotId: row.shotId,
    originalName: row.originalName,
    sha256: row.sha256,
    sizeBytes: row.sizeBytes,
    codec: row.codec,
    formatName: row.formatName,
    width: row.width,
    height: row.height,
    rotationDeg: row.rotationDeg,
    frameWidth: turned ? row.height : row.width,
    frameHeight: turned ? row.width : row.height,
    containerFps: row.containerFps,
    captureFps: row.captureFps,
    frameCount: row.frameCount,
    durationS: row.durationS,
    variableFrameRate: row.variableFrameRate,
    warnings,
    inFrame: row.inFrame,
    outFrame: row.outFrame,
    shutterS: row.shutterS,
    frameStamp: row.frameStamp,
    exposureShiftS: row.shutterS === null ? 0 : midExposureShiftS(row.shutterS, row.frameStamp),
    status: row.status,
    progress: row.progress,
    error: row.error,
    waitingFor: row.status === 'queued' ? (row.waitingFor ?? null) : null,
    extractedCount: row.extractedCount,
    thumbnailCount: row.thumbnailCount,
    duplicateOf,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Clips of the team matching `where`, newest first, with their duplicate's name. */
export async function loadClipViews(db: Db, teamId: string, filter: { clipId?: string; shotId?: string }): Promise<ClipView[]> {
  const conditions = [eq(clips.teamId, teamId)];
  if (filter.clipId) conditions.push(eq(clips.id, filter.clipId));
  if (filter.shotId) conditions.push(eq(clips.shotId, filter.shotId));
  const rows = await db
    .select({ clip: viewColumns, dup: { clipId: duplicate.id, shotId: duplicate.shotId, originalName: duplicate.originalName } })
    .from(clips)
    .leftJoin(duplicate, eq(duplicate.id, clips.duplicateOfClipId))
    .where(and(...conditions))
    .orderBy(clips.createdAt);
  return rows.map((r) => toClipView(r.clip, r.dup?.clipId ? { clipId: r.dup.clipId, shotId: r.dup.shotId, originalName: r.dup.originalName } : null));
}

export async function loadClipView(db: Db, teamId: string, clipId: string): Promise<ClipView | null> {
  const [view] = await loadClipViews(db, teamId, { clipId });
  return view ?? null;
}
