import { z } from 'zod';
import { INT4_MAX, Uuid } from './common';
import type {
  BandSchema,
  FitCandidateSchema,
  FitPresetComparisonSchema,
  ForecastResponseSchema,
  KeepOutResponseSchema,
  MeasuredVsForecastResponseSchema,
  MeasuredVsForecastRowSchema,
  PersonNameSchema,
  PooledSummarySchema,
  PoolPreviewSchema,
  PresetDetailSchema,
  PresetHeterogeneitySchema,
  PresetSummarySchema,
  PresetVersionDiffRowSchema,
  PresetVersionDiffSchema,
  PresetVersionSchema,
  SweepRowSchema,
} from './preset-responses';
import { limitText } from '../fits/format';

// Design presets, their versions, forecasts and keep-out distances. SI units in
// the API (Pa, m, m/s); air temperature in °C and humidity in %, as instruments read.

export const PRESET_LAUNCHER_MODELS = ['constant-pressure', 'adiabatic'] as const;
export type PresetLauncherModel = (typeof PRESET_LAUNCHER_MODELS)[number];

export const LAUNCHER_MODEL_LABELS: Record<PresetLauncherModel, string> = {
  'constant-pressure': 'constant pressure along the barrel',
  adiabatic: 'adiabatic expansion of the chamber',
};

const finite = (message = 'must be a number') => z.number({ error: message }).refine(Number.isFinite, 'must be a finite number');
const between = (min: number, max: number, unit: string) => finite().refine((v) => v >= min && v <= max, `must be between ${limitText(min, unit)} and ${limitText(max, unit)}`);
const Name = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');
const Note = z.string().trim().max(2000, 'must be at most 2000 characters').default('');
/** The factor the keep-out range is multiplied by; below 1 would shrink the worst case. */
export const SafetyFactor = between(1, 10, '(a factor)');
export const DEFAULT_SAFETY_FACTOR = 1.5;

export const PresetParams = z.object({ teamId: Uuid, presetId: Uuid });
export const PresetVersionParams = z.object({ teamId: Uuid, presetId: Uuid, version: z.coerce.number().int().min(1, 'must be 1 or more').max(INT4_MAX) });
export const FitComparisonsParams = z.object({ teamId: Uuid, fitId: Uuid });

export const PresetCreateBody = z
  .object({
    name: Name,
    launcherId: Uuid,
    projectileId: Uuid,
    pressureMinPa: between(1e3, 1e8, 'Pa'),
    pressureMaxPa: between(1e3, 1e8, 'Pa'),
    /** A body from the handbook drag table; the first version starts from its value. */
    handbookBody: z.string().trim().min(1).max(200).default('smooth sphere, subcritical'),
    /** Energy efficiency assumed until fits say otherwise. */
    efficiency: between(0.01, 1, '(a fraction)').default(0.6),
    efficiencyStd: between(0.001, 1, '(a fraction)').default(0.15),
    efficiencyNote: z.string().trim().max(400, 'must be at most 400 characters').default(''),
    safetyFactor: SafetyFactor.default(DEFAULT_SAFETY_FACTOR),
    note: Note,
  })
  .refine((v) => v.pressureMaxPa >= v.pressureMinPa, { message: 'must be at least the minimum pressure', path: ['pressureMaxPa'] });
export type PresetCreateBody = z.input<typeof PresetCreateBody>;

export const FitIdList = z.array(Uuid).min(1, 'choose at least one approved fit').max(200, 'at most 200 fits');

export const PoolPreviewBody = z.object({ fitIds: FitIdList });
export type PoolPreviewBody = z.input<typeof PoolPreviewBody>;

export const PublishVersionBody = z.object({
  fitIds: FitIdList,
  note: Note,
  safetyFactor: SafetyFactor.optional(),
});
export type PublishVersionBody = z.input<typeof PublishVersionBody>;

export const RecordComparisonsBody = z.object({ fitIds: FitIdList });

/** Shot conditions for a forecast. */
export const ForecastBody = z.object({
  presetId: Uuid,
  version: z.number().int().min(1).max(INT4_MAX).optional(),
  pressurePa: between(1e3, 1e8, 'Pa'),
  elevationDeg: between(1, 89, '°'),
  airTempC: between(-40, 60, '°C').default(15),
  stationPressurePa: between(5e4, 1.1e5, 'Pa').default(101325),
  relativeHumidityPct: between(0, 100, '%').default(50),
  targetHeightM: between(-500, 500, 'm').default(0),
  /** Along the line of fire, positive with the shot (tail wind). */
  windMps: between(-30, 30, 'm/s').default(0),
});
export type ForecastBody = z.input<typeof ForecastBody>;

export const PresetVersionQuery = z.object({ version: z.coerce.number().int().min(1).max(INT4_MAX).optional() });

/** Keep-out conditions: thin air carries further, so the default is a hot, high day. */
export const KeepOutQuery = PresetVersionQuery.extend({
  airTempC: z.coerce.number().min(-40).max(60).default(35),
  stationPressurePa: z.coerce.number().min(5e4).max(1.1e5).default(95000),
  relativeHumidityPct: z.coerce.number().min(0).max(100).default(0),
});

// ── Response shapes ─────────────────────────────────────────────────────────

export type PooledSummary = z.infer<typeof PooledSummarySchema>;
export type PresetHeterogeneity = z.infer<typeof PresetHeterogeneitySchema>;
export type PersonName = z.infer<typeof PersonNameSchema>;
export type PresetVersionDiffRow = z.infer<typeof PresetVersionDiffRowSchema>;
export type PresetVersionDiff = z.infer<typeof PresetVersionDiffSchema>;
export type PresetVersion = z.infer<typeof PresetVersionSchema>;
export type PresetSummary = z.infer<typeof PresetSummarySchema>;
export type PresetDetail = z.infer<typeof PresetDetailSchema>;
export type FitCandidate = z.infer<typeof FitCandidateSchema>;
export type PoolPreview = z.infer<typeof PoolPreviewSchema>;
export type Band = z.infer<typeof BandSchema>;
export type SweepRow = z.infer<typeof SweepRowSchema>;
export type ForecastResponse = z.infer<typeof ForecastResponseSchema>;
export type KeepOutResponse = z.infer<typeof KeepOutResponseSchema>;
export type MeasuredVsForecastRow = z.infer<typeof MeasuredVsForecastRowSchema>;
export type MeasuredVsForecastResponse = z.infer<typeof MeasuredVsForecastResponseSchema>;
export type FitPresetComparison = z.infer<typeof FitPresetComparisonSchema>;
