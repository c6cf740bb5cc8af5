import { mulberry32, normalDeviates } from '../../shared/random/prng';
import { and, eq } from 'drizzle-orm';
import { buildCalibrationTransform } from '../../shared/geometry/calibration-transform';
import type { TrackKind } from '../../shared/schemas/marking';
import { audit } from '../audit';
import { loadConfig } from '../config';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { fits } from '../db/schema/fits';
import { calibrations, marks, tracks } from '../db/schema/marking';
import { shots, testSeries } from '../db/schema/records';
import { users } from '../db/schema/users';
import type { ClipTruth } from '../fixtures/clip-generator';
import { buildFitSnapshot } from '../fits/build-fit-input';
import { computeFit, storeFit } from '../fits/run-fit';
import { calibrationValues } from '../marking/calibration-records';
import { createStorage } from '../storage/create-storage';
import { clipPrefix, readAll } from '../storage/storage';
import { demoPerson } from './demo-people';
import { DEMO_SERIES_NAME } from './demo-records';
import type { SeedStep } from './seed-demo';

// The morning session's clips as Tomas Reyes left them: calibrated from the
// reference bar, the projectile marked (the rendered truth plus a little
// marking scatter), and fitted. Dev Okafor has approved H-01; H-02 waits for
// review; H-03 is marked but not fitted yet. Keyed by track name and shot, so
// a second start changes nothing.

const PROJECTILE_TRACK = 'Foam head';
const MUZZLE_TRACK = 'Muzzle';
/** Standard deviation of the demo marks around the truth: a careful tracker with sub-pixel snapping. */
const MARK_SCATTER_PX = 0.3;

interface DemoFitPlan {
  label: string;
  seed: number;
  fit: 'approved' | 'awaiting-review' | null;
  muzzle: boolean;
}

const PLANS: DemoFitPlan[] = [
  { label: 'H-01', seed: 201, fit: 'approved', muzzle: true },
  { label: 'H-02', seed: 202, fit: 'awaiting-review', muzzle: false },
  { label: 'H-03', seed: 203, fit: null, muzzle: false },
];

const APPROVAL_NOTE = 'Residuals flat, drag resolved; fine as the OL-40 reference shot.';

async function userIdOf(db: Db, email: string): Promise<string | null> {
  const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  return row?.id ?? null;
}

async function ensureCalibration(db: Db, clipId: string, truth: ClipTruth, createdBy: string | null) {
  const [existing] = await db.select({ id: calibrations.id }).from(calibrations).where(eq(calibrations.clipId, clipId)).limit(1);
  if (existing) return;
  const body = {
    scale: { p1: truth.scaleReference.p1, p2: truth.scaleReference.p2, lengthM: truth.scaleReference.lengthM, lengthTolM: 0.001, endpointSigmaPx: 0.5 },
    origin: truth.originPx,
    level: { kind: 'line' as const, p1: truth.levelLine.p1, p2: truth.levelLine.p2 },
    downrange: 'right' as const,
    plane: null,
    note: 'Reference bar on the fence post, level from the painted line.',
  };
  await db.insert(calibrations).values({ clipId, version: 1, ...calibrationValues(body, buildCalibrationTransform(body)), createdBy });
}

async function ensureTrack(db: Db, teamId: string, clipId: string, name: string, kind: TrackKind, points: { frameNumber: number; u: number; v: number }[], by: string | null) {
  const [existing] = await db.select({ id: tracks.id }).from(tracks).where(and(eq(tracks.clipId, clipId), eq(tracks.name, name)));
  if (existing) return existing.id;
  return db.transaction(async (tx) => {
    // One write of the whole track: its revision is 1 and every mark carries it (docs/marking-api.md).
    const [track] = await tx.insert(tracks).values({ clipId, teamId, name, kind, revision: 1, createdBy: by }).returning({ id: tracks.id });
    await tx.insert(marks).values(
      points.map((p) => ({ trackId: track.id, frameNumber: p.frameNumber, uPx: p.u, vPx: p.v, placedUPx: p.u, placedVPx: p.v, snapped: true, revision: 1, updatedBy: by })),
    );
    return track.id;
  });
}

async function seedFits(db: Db, teamId: string): Promise<void> {
  const storage = createStorage(loadConfig());
  const analyst = await userIdOf(db, demoPerson('analyst').email);
  const engineer = await userIdOf(db, demoPerson('engineer').email);
  const tracker = await userIdOf(db, demoPerson('tracker').email);
  if (!analyst) throw new Error('demo analyst missing: the people step must run first');

  for (const plan of PLANS) {
    const [clip] = await db
      .select({ id: clips.id, status: clips.status, shotId: clips.shotId })
      .from(clips)
      .innerJoin(shots, eq(shots.id, clips.shotId))
      .innerJoin(testSeries, eq(testSeries.id, shots.seriesId))
      .where(and(eq(clips.teamId, teamId), eq(shots.label, plan.label), eq(testSeries.name, DEMO_SERIES_NAME)))
      .limit(1);
    // Without the clips step (or its truth files) there is nothing to mark; the rest of the demo still works.
    if (!clip || clip.status !== 'ready') continue;
    const truthKey = `${clipPrefix(teamId, clip.id)}truth.json`;
    if (!(await storage.stat(truthKey))) continue;
    const truth = JSON.parse((await readAll(storage, truthKey)).toString('utf8')) as ClipTruth;

    await ensureCalibration(db, clip.id, truth, analyst);
    const noise = normalDeviates(mulberry32(plan.seed));
    const trackId = await ensureTrack(
      db,
      teamId,
      clip.id,
      PROJECTILE_TRACK,
      'projectile',
      truth.frames.map((f) => ({ frameNumber: f.frameNumber, u: f.uPx + MARK_SCATTER_PX * noise(), v: f.vPx + MARK_SCATTER_PX * noise() })),
      tracker,
    );
    if (plan.muzzle) {
      // The muzzle sits where the path was three frames before the first mark
      // (straight back along the first step: gravity moves it < 0.1 px in that time).
      const [a, b] = truth.frames;
      await ensureTrack(db, teamId, clip.id, MUZZLE_TRACK, 'muzzle', [{ frameNumber: a.frameNumber, u: a.uPx - 3 * (b.uPx - a.uPx), v: a.vPx - 3 * (b.vPx - a.vPx) }], tracker);
    }

    if (!plan.fit) continue;
    const [already] = await db.select({ id: fits.id }).from(fits).where(eq(fits.trackId, trackId)).limit(1);
    if (already) continue;
    const snapshot = await buildFitSnapshot(db, teamId, trackId);
    const fitId = await storeFit(db, { teamId, userId: analyst, snapshot, result: computeFit(snapshot) });
    if (plan.fit === 'approved' && engineer) {
      await db.transaction(async (tx) => {
        await tx.update(fits).set({ state: 'approved', reviewedBy: engineer, reviewedAt: new Date(), reviewNote: APPROVAL_NOTE }).where(eq(fits.id, fitId));
        await audit(tx, { teamId, actorUserId: engineer, action: 'fit.approve', targetType: 'fit', targetId: fitId, detail: { note: APPROVAL_NOTE } });
      });
    }
  }
}

export const demoFitsStep: SeedStep = { name: 'calibrations, marks and fits of the demo clips', run: seedFits };
