import { and, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { launchers, projectiles, testSeries } from '../db/schema/records';
import type { SeedStep } from './seed-demo';

// Ollendry Line Works' kit and its first test session at Wendlow Flats.
// Shots and clips of this series are seeded by the clips seed step,
// which finds these rows by name; these names are the contract between the two steps.
export const DEMO_SERIES_NAME = 'Wendlow Flats — morning session';
export const DEMO_LAUNCHER_NAMES = { lt40: 'Ollendry OL-40 line thrower', lt25: 'Ollendry OL-25 trainer' } as const;
export const DEMO_PROJECTILE_NAMES = { foamHead40: 'Foam line head 40', rubberBall25: 'Rubber training ball 25' } as const;

const DEMO_LAUNCHERS = [
  {
    name: DEMO_LAUNCHER_NAMES.lt40,
    kind: 'compressed-air line thrower',
    boreM: 0.04,
    barrelLengthM: 0.6,
    chamberVolumeM3: 0.0015,
    maxWorkingPressurePa: 1.0e6,
    valveType: 'piston quick-exhaust',
  },
  {
    name: DEMO_LAUNCHER_NAMES.lt25,
    kind: 'compressed-air trainer',
    boreM: 0.025,
    barrelLengthM: 0.45,
    chamberVolumeM3: 0.0006,
    maxWorkingPressurePa: 8.0e5,
    valveType: 'diaphragm',
  },
];

const DEMO_PROJECTILES = [
  { name: DEMO_PROJECTILE_NAMES.foamHead40, massKg: 0.055, diameterM: 0.04, shape: 'blunt cylinder' },
  { name: DEMO_PROJECTILE_NAMES.rubberBall25, massKg: 0.012, diameterM: 0.025, shape: 'sphere' },
];

const DEMO_SERIES = {
  name: DEMO_SERIES_NAME,
  testDate: '2026-04-18',
  site: 'Wendlow Flats test field',
  notes: 'Calm morning, light dew. OL-40 with foam heads along the north lane.',
};

async function seedRecords(db: Db, teamId: string): Promise<void> {
  for (const launcher of DEMO_LAUNCHERS) {
    const [found] = await db.select({ id: launchers.id }).from(launchers).where(and(eq(launchers.teamId, teamId), eq(launchers.name, launcher.name)));
    if (!found) await db.insert(launchers).values({ ...launcher, teamId });
  }
  for (const projectile of DEMO_PROJECTILES) {
    const [found] = await db.select({ id: projectiles.id }).from(projectiles).where(and(eq(projectiles.teamId, teamId), eq(projectiles.name, projectile.name)));
    if (!found) await db.insert(projectiles).values({ ...projectile, teamId });
  }
  const [series] = await db.select({ id: testSeries.id }).from(testSeries).where(and(eq(testSeries.teamId, teamId), eq(testSeries.name, DEMO_SERIES.name)));
  if (!series) await db.insert(testSeries).values({ ...DEMO_SERIES, teamId });
}

export const demoRecordsStep: SeedStep = { name: 'records (launchers, projectiles, series)', run: seedRecords };
