import { z } from 'zod';
import { CLIP_STATUSES } from './clips';
import { Uuid } from './common';
import type { Page, Shot } from './records';

// What the record routes answer, as zod, for the OpenAPI document and the contract
// test. Series, Launcher and Projectile in records.ts are z.infer of these; the Shot
// interface there is checked against ShotResponse below, so the two cannot drift apart.

const IsoTimestamp = z.string().describe('ISO 8601 date and time');
const nullableNumber = z.number().nullable();

export const SeriesResponse = z.object({
  id: Uuid,
  name: z.string(),
  /** YYYY-MM-DD (ISO 8601 calendar date, no time zone). */
  testDate: z.string(),
  site: z.string().nullable(),
  notes: z.string().nullable(),
  createdAt: IsoTimestamp,
  shotCount: z.number().int().min(0),
});
export const SeriesList = z.array(SeriesResponse);

export const LauncherResponse = z.object({
  id: Uuid,
  name: z.string(),
  kind: z.string().nullable(),
  boreM: nullableNumber,
  barrelLengthM: nullableNumber,
  chamberVolumeM3: nullableNumber,
  maxWorkingPressurePa: nullableNumber,
  valveType: z.string().nullable(),
  notes: z.string().nullable(),
  createdAt: IsoTimestamp,
});
export const LauncherList = z.array(LauncherResponse);

export const ProjectileResponse = z.object({
  id: Uuid,
  name: z.string(),
  massKg: z.number(),
  diameterM: z.number(),
  shape: z.string().nullable(),
  /** Frontal area used for Cd; null: π d²/4. */
  referenceAreaM2: nullableNumber,
  notes: z.string().nullable(),
  createdAt: IsoTimestamp,
});
export const ProjectileList = z.array(ProjectileResponse);

export const ShotResponse = z.object({
  id: Uuid,
  seriesId: Uuid,
  seriesName: z.string(),
  launcherId: Uuid.nullable(),
  launcherName: z.string().nullable(),
  projectileId: Uuid.nullable(),
  projectileName: z.string().nullable(),
  label: z.string(),
  chamberPressurePa: nullableNumber,
  elevationDeg: nullableNumber,
  airTempC: nullableNumber,
  stationPressurePa: nullableNumber,
  relativeHumidityPct: nullableNumber,
  tapeRangeM: nullableNumber,
  /** Speed, m/s, and the direction it blows from, degrees clockwise from the line of fire (0 headwind). */
  wind: z.object({ speedMps: z.number(), fromDeg: z.number() }).nullable(),
  launchHeightM: nullableNumber,
  /** Air density stated directly, used instead of temperature, pressure and humidity. */
  airDensity: z.object({ densityKgM3: z.number(), tolKgM3: nullableNumber }).nullable(),
  notes: z.string().nullable(),
  createdAt: IsoTimestamp,
  updatedAt: IsoTimestamp,
  latestClip: z.object({ id: Uuid, status: z.enum(CLIP_STATUSES), progress: z.number() }).nullable(),
});

/** One page of a long list. */
export function pageOf<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), total: z.number().int().min(0), page: z.number().int().min(1), pageSize: z.number().int().min(1) });
}
export const ShotPage = pageOf(ShotResponse);

// Compile-time: the interfaces the client uses equal what the schemas describe.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const sameShot: Same<z.infer<typeof ShotResponse>, Shot> = true;
const samePage: Same<z.infer<typeof ShotPage>, Page<Shot>> = true;
void sameShot;
void samePage;
