// The fit command's logic, kept free of process and file-system access so it
// can be tested directly: argument parsing, running fitShot, and the printed
// summary. server/cli/fit.ts only wires these to argv, the file and stdout.
import { UNKNOWN_AIR_DENSITY_KG_M3 } from '../defaults';
import { humidAirDensityKgM3 } from './air';
import { fitShot } from './fit-shot';
import { parseFitMarksCsv } from '../marking/marks-csv';
import type { Estimate, FitShotResult } from './types';
import { FitInputError } from './validate-marks';

export const FIT_USAGE =
  'usage: fit <marks.csv> --mass-kg M --diameter-m D [--air-density-kgm3 R | --temp-c T --pressure-hpa P --rh H] ' +
  '[--muzzle-x-m X --muzzle-y-m Y]';


export interface FitCliOptions {
  csvPath: string;
  massKg: number;
  diameterM: number;
  air: { kind: 'density'; densityKgM3: number } | { kind: 'weather'; temperatureC: number; pressureHpa: number; rhPercent: number } | { kind: 'default' };
  muzzle?: { xM: number; yM: number };
}

const FLAGS = ['mass-kg', 'diameter-m', 'air-density-kgm3', 'temp-c', 'pressure-hpa', 'rh', 'muzzle-x-m', 'muzzle-y-m'] as const;
type Flag = (typeof FLAGS)[number];

export function parseFitArgs(argv: string[]): FitCliOptions {
  const values = new Map<Flag, number>();
  const positional: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (!arg.startsWith('--')) { positional.push(arg); continue; }
    const eq = arg.indexOf('=');
    const name = (eq >= 0 ? arg.slice(2, eq) : arg.slice(2)) as Flag;
    if (!FLAGS.includes(name)) throw new FitInputError(`unknown option --${name}; ${FIT_USAGE}`);
    const raw = eq >= 0 ? arg.slice(eq + 1) : argv[++i];
    if (raw === undefined) throw new FitInputError(`--${name} needs a value`);
    const v = Number(raw);
    if (raw.trim() === '' || !Number.isFinite(v)) throw new FitInputError(`--${name} must be a number, got ${JSON.stringify(raw)}`);
    if (values.has(name)) throw new FitInputError(`--${name} given twice`);
    values.set(name, v);
  }
  if (positional.length !== 1) throw new FitInputError(`expected exactly one marks CSV file; ${FIT_USAGE}`);
  const need = (f: Flag) => {
    const v = values.get(f);
    if (v === undefined) throw new FitInputError(`--${f} is required; ${FIT_USAGE}`);
    return v;
  };
  const massKg = need('mass-kg');
  const diameterM = need('diameter-m');
  if (!(massKg > 0)) throw new FitInputError('--mass-kg must be positive');
  if (!(diameterM > 0)) throw new FitInputError('--diameter-m must be positive');

  const weatherFlags = (['temp-c', 'pressure-hpa', 'rh'] as const).filter((f) => values.has(f));
  let air: FitCliOptions['air'] = { kind: 'default' };
  if (values.has('air-density-kgm3')) {
    if (weatherFlags.length > 0) throw new FitInputError('give either --air-density-kgm3 or --temp-c/--pressure-hpa/--rh, not both');
    const r = values.get('air-density-kgm3')!;
    if (!(r > 0)) throw new FitInputError('--air-density-kgm3 must be positive');
    air = { kind: 'density', densityKgM3: r };
  } else if (weatherFlags.length > 0) {
    if (weatherFlags.length !== 3) throw new FitInputError('--temp-c, --pressure-hpa and --rh must be given together');
    const rh = values.get('rh')!;
    if (!(rh >= 0 && rh <= 100)) throw new FitInputError('--rh is relative humidity in percent, 0 to 100');
    if (!(values.get('pressure-hpa')! > 0)) throw new FitInputError('--pressure-hpa must be positive');
    air = { kind: 'weather', temperatureC: values.get('temp-c')!, pressureHpa: values.get('pressure-hpa')!, rhPercent: rh };
  }
  const mx = values.get('muzzle-x-m');
  const my = values.get('muzzle-y-m');
  if ((mx === undefined) !== (my === undefined)) throw new FitInputError('--muzzle-x-m and --muzzle-y-m must be given together');
  return { csvPath: positional[0], massKg, diameterM, air, muzzle: mx !== undefined ? { xM: mx, yM: my! } : undefined };
}

export function airDensityFor(options: FitCliOptions): number {
  switch (options.air.kind) {
    case 'density': return options.air.densityKgM3;
    case 'weather':
      return humidAirDensityKgM3({
        temperatureC: options.air.temperatureC,
        pressurePa: options.air.pressureHpa * 100,
        relativeHumidity: options.air.rhPercent / 100,
      });
    default: return UNKNOWN_AIR_DENSITY_KG_M3;
  }
}

export interface FitCliSummary {
  model: FitShotResult['model'];
  launchSpeedMps: Estimate;
  launchAngleDeg: Estimate;
  dragK_perM: Estimate;
  dragCoefficient: Estimate;
  x0M: Estimate;
  y0M: Estimate;
  rmsResidualM: number;
  dragVerdict: string;
  muzzleSpeedMps?: Estimate;
  airDensityKgM3: number;
  cautions: string[];
}

export function summarise(result: FitShotResult, airDensityKgM3: number, cautions: string[] = []): FitCliSummary {
  const s: FitCliSummary = {
    model: result.model,
    launchSpeedMps: result.launchSpeedMps,
    launchAngleDeg: result.launchAngleDeg,
    dragK_perM: result.dragK_perM,
    dragCoefficient: result.dragCoefficient,
    x0M: result.x0M,
    y0M: result.y0M,
    rmsResidualM: result.rmsResidualM,
    dragVerdict: result.dragVerdict,
    airDensityKgM3,
    cautions: [...cautions, ...result.cautions],
  };
  if (result.muzzle) s.muzzleSpeedMps = result.muzzle.speedMps;
  return s;
}

export interface CliOutcome {
  exitCode: number;
  stdout: string;
  stderr: string;
}

/** Whole command as a pure function of argv and a file reader (which may throw). */
export function runFitCli(argv: string[], readText: (path: string) => string): CliOutcome {
  try {
    const options = parseFitArgs(argv);
    let text: string;
    try {
      text = readText(options.csvPath);
    } catch (e) {
      const code = (e as { code?: string }).code;
      throw new FitInputError(`cannot read ${options.csvPath}${code ? ` (${code})` : ''}`);
    }
    const marks = parseFitMarksCsv(text);
    const airDensityKgM3 = airDensityFor(options);
    const cautions = options.air.kind === 'default'
      ? [`No air data given: assumed ${UNKNOWN_AIR_DENSITY_KG_M3} kg/m^3 (standard sea level); Cd scales inversely with it.`]
      : [];
    const result = fitShot({ marks, massKg: options.massKg, diameterM: options.diameterM, airDensityKgM3, muzzle: options.muzzle });
    return { exitCode: 0, stdout: `${JSON.stringify(summarise(result, airDensityKgM3, cautions), null, 2)}\n`, stderr: '' };
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const prefix = e instanceof FitInputError || e instanceof RangeError ? 'fit: ' : 'fit: internal error: ';
    return { exitCode: e instanceof FitInputError || e instanceof RangeError ? 2 : 1, stdout: '', stderr: `${prefix}${message.replace(/\s*\n\s*/g, ' ')}\n` };
  }
}
