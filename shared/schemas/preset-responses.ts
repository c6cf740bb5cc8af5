import { z } from 'zod';
import { Uuid } from './common';
import { ForecastBody, PRESET_LAUNCHER_MODELS } from './presets';

// What the preset routes answer, as zod, for the OpenAPI document and the contract
// check; the response types in presets.ts are z.infer of these.

const IsoTimestamp = z.string().describe('ISO 8601 date and time');
const LauncherModel = z.enum(PRESET_LAUNCHER_MODELS);
const NamedRef = z.object({ id: Uuid, name: z.string() });

/** A random-effects pool of per-fit values with its heterogeneity (Cochran's Q, I², Birge ratio). */
export const PooledSummarySchema = z.object({
  value: z.number(),
  stdErr: z.number(),
  stdErrFixed: z.number(),
  count: z.number().int(),
  cochranQ: z.number(),
  degreesOfFreedom: z.number().int(),
  iSquared: z.number(),
  pValue: z.number().nullable(),
  birgeRatio: z.number().nullable(),
  disagree: z.boolean(),
  verdict: z.string(),
});

export const PresetHeterogeneitySchema = z.object({ dragCoefficient: PooledSummarySchema.nullable(), efficiency: PooledSummarySchema.nullable() });

export const PersonNameSchema = z.object({ id: Uuid, displayName: z.string() });

export const PresetVersionDiffRowSchema = z.object({
  field: z.string(),
  label: z.string(),
  before: z.union([z.number(), z.string()]).nullable(),
  after: z.union([z.number(), z.string()]).nullable(),
  /** after − before for numbers. */
  change: z.number().nullable(),
  relativeChange: z.number().nullable(),
});

export const PresetVersionDiffSchema = z.object({
  fromVersion: z.number().int().nullable(),
  toVersion: z.number().int(),
  rows: z.array(PresetVersionDiffRowSchema),
  fitsAdded: z.array(Uuid),
  fitsRemoved: z.array(Uuid),
});

const versionFields = {
  id: Uuid,
  version: z.number().int(),
  dragCoefficient: z.number(),
  dragCoefficientStd: z.number(),
  efficiency: z.number(),
  efficiencyStd: z.number(),
  launcherModel: LauncherModel,
  dragSource: z.string(),
  efficiencySource: z.string(),
  pooledFitIds: z.array(Uuid),
  heterogeneity: PresetHeterogeneitySchema.nullable(),
  keepOutSafetyFactor: z.number(),
  note: z.string(),
  publishedBy: PersonNameSchema.nullable(),
  publishedAt: IsoTimestamp,
};
export const PresetVersionSchema = z.object({ ...versionFields, diff: PresetVersionDiffSchema });

export const PresetSummarySchema = z.object({
  id: Uuid,
  name: z.string(),
  launcher: NamedRef,
  projectile: NamedRef,
  pressureMinPa: z.number(),
  pressureMaxPa: z.number(),
  createdAt: IsoTimestamp,
  latest: z.object(versionFields).nullable(),
  versionCount: z.number().int(),
});
export const PresetList = z.array(PresetSummarySchema);

export const PresetDetailSchema = PresetSummarySchema.extend({
  launcherRecord: z.object({
    boreM: z.number().nullable(),
    barrelLengthM: z.number().nullable(),
    chamberVolumeM3: z.number().nullable(),
    maxWorkingPressurePa: z.number().nullable(),
    valveType: z.string().nullable(),
  }),
  projectileRecord: z.object({ massKg: z.number(), diameterM: z.number(), shape: z.string().nullable(), referenceAreaM2: z.number().nullable() }),
  versions: z.array(PresetVersionSchema),
});

export const FitCandidateSchema = z.object({
  fitId: Uuid,
  shotId: Uuid,
  shotLabel: z.string(),
  reviewedAt: IsoTimestamp.nullable(),
  chamberPressurePa: z.number().nullable(),
  dragCoefficient: z.object({ value: z.number(), stdErr: z.number() }).nullable(),
  efficiency: z.object({ value: z.number(), stdErr: z.number(), measuredSpeedMps: z.number(), modelSpeedMps: z.number() }).nullable(),
  /** Why a number could not be taken from this fit. */
  notes: z.array(z.string()),
  usable: z.boolean(),
});
export const FitCandidateList = z.array(FitCandidateSchema);

export const PoolPreviewSchema = z.object({
  dragCoefficient: PooledSummarySchema,
  efficiency: PooledSummarySchema.nullable(),
  fitIds: z.array(Uuid),
  notes: z.array(z.string()),
});

/** What POST …/versions/:version/comparisons recorded. */
export const RecordedComparisons = z.object({ version: z.number().int(), fitIds: z.array(Uuid) });
export type RecordedComparisons = z.infer<typeof RecordedComparisons>;

export const BandSchema = z.object({ low: z.number(), median: z.number(), high: z.number() });

export const SweepRowSchema = z.object({
  elevationDeg: z.number(),
  rangeM: z.number().nullable(),
  apexHeightM: z.number(),
  timeOfFlightS: z.number().nullable(),
  impactSpeedMps: z.number().nullable(),
  vacuumRangeM: z.number().nullable(),
});

const AirUsed = z.object({ densityKgM3: z.number(), source: z.string() });
const PathPoints = z.array(z.object({ xM: z.number(), yM: z.number() }));

export const ForecastResponseSchema = z.object({
  preset: NamedRef,
  version: z.object({
    version: z.number().int(),
    dragCoefficient: z.number(),
    dragCoefficientStd: z.number(),
    efficiency: z.number(),
    efficiencyStd: z.number(),
    launcherModel: LauncherModel,
  }),
  air: AirUsed,
  /** The request as used, defaults filled in. */
  inputs: ForecastBody,
  modelSpeedMps: z.number(),
  muzzleSpeedMps: z.number(),
  dragK_perM: z.number(),
  withDrag: z.object({
    reachesTarget: z.boolean(),
    rangeM: z.number().nullable(),
    apexHeightM: z.number(),
    timeOfFlightS: z.number().nullable(),
    impactSpeedMps: z.number().nullable(),
    impactAngleDeg: z.number().nullable(),
  }),
  vacuum: z.object({ rangeM: z.number().nullable(), apexHeightM: z.number(), timeOfFlightS: z.number().nullable() }),
  bestElevation: z.object({ angleDeg: z.number(), rangeM: z.number(), vacuumAngleDeg: z.literal(45), vacuumRangeM: z.number() }),
  trajectories: z.object({ drag: PathPoints, vacuum: PathPoints }),
  sweep: z.array(SweepRowSchema),
  band: z.object({
    method: z.string(),
    samples: z.number().int(),
    seed: z.number().int(),
    muzzleSpeedMps: BandSchema,
    rangeM: BandSchema.nullable(),
    apexHeightM: BandSchema,
    timeOfFlightS: BandSchema.nullable(),
  }),
  cautions: z.array(z.string()),
});

export const KeepOutResponseSchema = z.object({
  presetId: Uuid,
  version: z.number().int(),
  maxWorkingPressurePa: z.number(),
  modelSpeedMps: z.number(),
  efficiencyUpper: z.number(),
  speedUpperMps: z.number(),
  dragCoefficientLower: z.number(),
  air: AirUsed,
  bestElevationDeg: z.number(),
  maxRangeM: z.number(),
  safetyFactor: z.number(),
  keepOutM: z.number(),
  vacuumCeilingM: z.number(),
  vacuumAtUpperSpeedM: z.number(),
  method: z.string(),
  cautions: z.array(z.string()),
});

export const MeasuredVsForecastRowSchema = z.object({
  fitId: Uuid,
  shotId: Uuid,
  shotLabel: z.string(),
  chamberPressurePa: z.number().nullable(),
  elevationDeg: z.number().nullable(),
  measuredSpeedMps: z.number(),
  measuredSpeedStdErr: z.number(),
  measuredFrom: z.enum(['muzzle', 'first mark']),
  forecastSpeedMps: z.number().nullable(),
  tapeRangeM: z.number().nullable(),
  forecastRangeM: z.number().nullable(),
  note: z.string().nullable(),
});

export const MeasuredVsForecastResponseSchema = z.object({ presetId: Uuid, version: z.number().int(), rows: z.array(MeasuredVsForecastRowSchema) });

export const FitPresetComparisonSchema = z.object({
  presetId: Uuid,
  presetName: z.string(),
  version: z.number().int(),
  role: z.enum(['pooled', 'compared']),
  comparedAt: IsoTimestamp,
});
export const FitPresetComparisonList = z.array(FitPresetComparisonSchema);
