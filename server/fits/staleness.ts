// A fit is measured against the inputs it was run on. When the track's marks
// (track revision) or the clip's current calibration version move on:
//  - a fit still awaiting review becomes 'stale' (stored, so lists agree);
//  - an approved or rejected fit keeps its state (it is a signed record) and
//    is flagged "inputs changed since review".
import { and, eq, inArray, max } from 'drizzle-orm';
import type { Staleness } from '../../shared/schemas/fits';
import type { DbOrTx } from '../db/client';
import { fits } from '../db/schema/fits';
import { calibrations, tracks } from '../db/schema/marking';

export interface FitVersions {
  id: string;
  trackId: string;
  clipId: string;
  marksRevision: number;
  calibrationVersion: number;
  state: string;
}

export async function currentVersions(db: DbOrTx, rows: Pick<FitVersions, 'trackId' | 'clipId'>[]) {
  const trackIds = [...new Set(rows.map((r) => r.trackId))];
  const clipIds = [...new Set(rows.map((r) => r.clipId))];
  const [trackRows, calRows] = await Promise.all([
    trackIds.length ? db.select({ id: tracks.id, revision: tracks.revision }).from(tracks).where(inArray(tracks.id, trackIds)) : [],
    clipIds.length
      ? db.select({ clipId: calibrations.clipId, version: max(calibrations.version) }).from(calibrations).where(inArray(calibrations.clipId, clipIds)).groupBy(calibrations.clipId)
      : [],
  ]);
  return {
    marksRevision: new Map(trackRows.map((t) => [t.id, t.revision])),
    calibrationVersion: new Map(calRows.map((c) => [c.clipId, c.version ?? null])),
  };
}

export function stalenessOf(fit: FitVersions, current: Awaited<ReturnType<typeof currentVersions>>): Staleness {
  const currentMarksRevision = current.marksRevision.get(fit.trackId) ?? null;
  const currentCalibrationVersion = current.calibrationVersion.get(fit.clipId) ?? null;
  const marksChanged = currentMarksRevision !== fit.marksRevision;
  const calibrationChanged = currentCalibrationVersion !== fit.calibrationVersion;
  const inputsChanged = marksChanged || calibrationChanged;
  const what = [marksChanged ? 'the marks' : null, calibrationChanged ? 'the calibration' : null].filter(Boolean).join(' and ');
  let message: string | null = null;
  if (inputsChanged) {
    message =
      fit.state === 'approved' || fit.state === 'rejected'
        ? `Inputs changed since review: ${what} changed after this fit ran. The reviewed numbers stay as they were; run a new fit to use the new inputs.`
        : `Inputs changed: ${what} changed after this fit ran. Run the fit again before review.`;
  }
  return { inputsChanged, marksChanged, calibrationChanged, currentMarksRevision, currentCalibrationVersion, message };
}

/**
 * Moves fits awaiting review whose inputs changed to 'stale'. Called on read
 * (detail, lists, review), so no other area has to know about fits.
 */
export async function refreshStaleness(db: DbOrTx, rows: FitVersions[]): Promise<Map<string, Staleness>> {
  const current = await currentVersions(db, rows);
  const out = new Map<string, Staleness>();
  const nowStale: string[] = [];
  for (const r of rows) {
    const s = stalenessOf(r, current);
    out.set(r.id, s);
    if (s.inputsChanged && r.state === 'awaiting-review') nowStale.push(r.id);
  }
  if (nowStale.length > 0) {
    await db.update(fits).set({ state: 'stale' }).where(and(inArray(fits.id, nowStale), eq(fits.state, 'awaiting-review')));
    for (const r of rows) if (nowStale.includes(r.id)) r.state = 'stale';
  }
  return out;
}
