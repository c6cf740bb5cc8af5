// Running a fit: the physics core on the snapshot's input, then one
// transaction that stores the fit with its headline numbers and the audit entry.
import type { FitInputSnapshot } from '../../shared/fits/snapshot';
import { fitShot, FitInputError } from '../../shared/physics/fit-shot';
import type { FitShotResult } from '../../shared/physics/types';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { fits } from '../db/schema/fits';
import { unprocessable } from '../http/problem';
import { canonicalJson, inputHash } from './input-hash';

const NUMERICAL_FAILURE =
  'The fit failed numerically: the marks and calibration give no finite solution (check the scale reference, the frame rate and marks far outside the picture), so nothing was stored.';

/**
 * fitShot on the stored input; bad input (too few marks, times out of order)
 * becomes a 422 the caller can act on, and so does a numerical failure (a
 * singular system, overflow to Infinity or NaN): input, not the server, is at fault.
 */
export function computeFit(snapshot: FitInputSnapshot): FitShotResult {
  let result: FitShotResult;
  try {
    // Through JSON, exactly as a stored snapshot comes back from the database,
    // so a fresh run and a later reproduction see the same numbers.
    result = fitShot(JSON.parse(JSON.stringify(snapshot.fitInput)));
  } catch (err) {
    if (err instanceof FitInputError) throw unprocessable(`The fit cannot run: ${err.message}.`);
    if (err instanceof RangeError || /singular|not finite|NaN|Infinity|converge/i.test(String((err as Error)?.message))) {
      throw unprocessable(NUMERICAL_FAILURE);
    }
    throw err;
  }
  const headline = [result.launchSpeedMps.value, result.launchAngleDeg.value, result.rmsResidualM];
  if (!headline.every(Number.isFinite)) throw unprocessable(NUMERICAL_FAILURE);
  return result;
}

/** The numbers a fit is listed and filtered by, copied out of its result. */
export function headlineColumns(result: FitShotResult) {
  const finite = (v: number) => (Number.isFinite(v) ? v : null);
  return {
    launchSpeedMps: result.launchSpeedMps.value,
    launchAngleDeg: result.launchAngleDeg.value,
    dragCoefficient: finite(result.dragCoefficient.value),
    dragK_perM: finite(result.dragK_perM.value),
    rmsResidualM: result.rmsResidualM,
    dragVerdict: result.dragVerdict,
  };
}

export interface StoreFitArgs {
  teamId: string;
  userId: string;
  snapshot: FitInputSnapshot;
  result: FitShotResult;
}

export async function storeFit(db: Db, { teamId, userId, snapshot, result }: StoreFitArgs): Promise<string> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(fits)
      .values({
        teamId,
        shotId: snapshot.shot.id,
        clipId: snapshot.clip.id,
        trackId: snapshot.track.id,
        calibrationId: snapshot.calibration.id,
        calibrationVersion: snapshot.calibration.version,
        marksRevision: snapshot.track.marksRevision,
        state: 'awaiting-review',
        inputSnapshot: snapshot,
        inputHash: inputHash(snapshot.fitInput),
        result,
        ...headlineColumns(result),
        createdBy: userId,
      })
      .returning({ id: fits.id });
    await audit(tx, {
      teamId,
      actorUserId: userId,
      action: 'fit.run',
      targetType: 'fit',
      targetId: row.id,
      detail: { shotId: snapshot.shot.id, trackId: snapshot.track.id, launchSpeedMps: result.launchSpeedMps.value, dragCoefficient: result.dragCoefficient.value },
    });
    return row.id;
  });
}

/** Paths where two JSON values differ (at most `limit`), e.g. "launchSpeedMps.value". */
export function jsonDifferences(a: unknown, b: unknown, path = '', out: string[] = [], limit = 20): string[] {
  if (out.length >= limit) return out;
  if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
    const keys = new Set([...Object.keys(a as object), ...Object.keys(b as object)]);
    for (const k of keys) {
      jsonDifferences((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], path ? `${path}.${k}` : k, out, limit);
    }
    return out;
  }
  if (!Object.is(a, b)) out.push(path || '(root)');
  return out;
}

/** Recompute from the stored snapshot and compare number for number with the stored result. */
export function reproduceFit(stored: { inputSnapshot: FitInputSnapshot; result: FitShotResult; inputHash: string }) {
  const fresh = JSON.parse(JSON.stringify(computeFit(stored.inputSnapshot)));
  const differences = jsonDifferences(stored.result, fresh);
  return {
    identical: differences.length === 0 && canonicalJson(stored.result) === canonicalJson(fresh),
    inputHashMatches: inputHash(stored.inputSnapshot.fitInput) === stored.inputHash,
    differences,
    result: fresh as FitShotResult,
  };
}
