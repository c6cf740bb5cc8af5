// Simple pneumatic-launcher models: what speed the gas could give the
// projectile, to compare with the measured muzzle speed. Both ignore friction,
// leakage, gas inertia and valve losses; the efficiency absorbs those.
import { GAMMA_AIR, SEA_LEVEL_PRESSURE_PA } from './constants';

export interface ConstantPressureInput {
  gaugePressurePa: number;
  boreDiameterM: number;
  barrelLengthM: number;
  massKg: number;
}

/**
 * Upper bound with the gauge pressure held constant along the barrel:
 * work = P_gauge A L, v = sqrt(2 P_gauge A L / m).
 */
export function constantPressureSpeedMps(input: ConstantPressureInput): number {
  const area = (Math.PI * input.boreDiameterM ** 2) / 4;
  return Math.sqrt((2 * input.gaugePressurePa * area * input.barrelLengthM) / input.massKg);
}

export interface AdiabaticInput extends ConstantPressureInput {
  /** Chamber (reservoir) volume charged to the gauge pressure. */
  chamberVolumeM3: number;
  atmosphericPressurePa?: number;
  gamma?: number;
}

export interface AdiabaticResult {
  speedMps: number;
  workJ: number;
  /** Absolute gas pressure behind the projectile at the muzzle. */
  muzzlePressurePa: number;
  /** True when the gas falls below atmospheric before the muzzle (the projectile would decelerate there). */
  underExpanded: boolean;
}

/**
 * Finite reservoir expanding adiabatically into the barrel, atmosphere on the
 * muzzle side: work = integral over x of (P0 (V0 / (V0 + A x))^gamma - P_atm) A dx
 *   = P0 V0 / (gamma - 1) [1 - (V0 / (V0 + A L))^(gamma - 1)] - P_atm A L,
 * with P0 the absolute charge pressure.
 */
export function adiabaticSpeed(input: AdiabaticInput): AdiabaticResult {
  const gamma = input.gamma ?? GAMMA_AIR;
  const pAtm = input.atmosphericPressurePa ?? SEA_LEVEL_PRESSURE_PA;
  const area = (Math.PI * input.boreDiameterM ** 2) / 4;
  const v0 = input.chamberVolumeM3;
  const sweptM3 = area * input.barrelLengthM;
  const p0 = input.gaugePressurePa + pAtm;
  const ratio = v0 / (v0 + sweptM3);
  // -expm1 keeps full precision when the barrel is tiny next to the chamber (ratio near 1).
  const expansion = -Math.expm1((gamma - 1) * Math.log(ratio));
  const workJ = ((p0 * v0) / (gamma - 1)) * expansion - pAtm * sweptM3;
  const muzzlePressurePa = p0 * Math.pow(ratio, gamma);
  return {
    speedMps: workJ > 0 ? Math.sqrt((2 * workJ) / input.massKg) : 0,
    workJ,
    muzzlePressurePa,
    underExpanded: muzzlePressurePa < pAtm,
  };
}

/** Energy efficiency: the share of the model's kinetic energy the shot actually got, (v_measured / v_model)^2. */
export function launcherEfficiency(measuredSpeedMps: number, modelSpeedMps: number): number {
  return (measuredSpeedMps / modelSpeedMps) ** 2;
}
