// Numbers derived from a fitted shot that say whether the model's
// assumptions hold: Reynolds and Mach numbers along the flight, ballistic
// coefficient and drag length, and plain-words cautions.

/** Above about Mach 0.6 local flow around a blunt body approaches sonic speed and Cd starts to rise. */
export const MACH_CAUTION = 0.6;
/** Window of the smooth-sphere drag crisis, where Cd drops sharply (Hoerner, Fluid-Dynamic Drag). */
export const DRAG_CRISIS_RE: [number, number] = [2e5, 5e5];

export function reynoldsNumber(speedMps: number, diameterM: number, airDensityKgM3: number, viscosityPaS: number): number {
  return (airDensityKgM3 * speedMps * diameterM) / viscosityPaS;
}

/** Ballistic coefficient m / (Cd A) in kg/m^2: higher means the body keeps its speed better. */
export function ballisticCoefficientKgM2(massKg: number, dragCoefficient: number, diameterM: number): number {
  return massKg / (dragCoefficient * (Math.PI * diameterM * diameterM) / 4);
}

export interface FlowCheckInput {
  speedMinMps: number;
  speedMaxMps: number;
  diameterM: number;
  airDensityKgM3: number;
  viscosityPaS: number;
  speedOfSoundMps: number;
}

export interface FlowCheck {
  reynoldsMin: number;
  reynoldsMax: number;
  machMax: number;
  cautions: string[];
}

export function checkFlow(input: FlowCheckInput): FlowCheck {
  const reynoldsMin = reynoldsNumber(input.speedMinMps, input.diameterM, input.airDensityKgM3, input.viscosityPaS);
  const reynoldsMax = reynoldsNumber(input.speedMaxMps, input.diameterM, input.airDensityKgM3, input.viscosityPaS);
  const machMax = input.speedMaxMps / input.speedOfSoundMps;
  const cautions: string[] = [];
  if (machMax > MACH_CAUTION) {
    cautions.push(
      `Peak Mach number ${machMax.toFixed(2)} is above ${MACH_CAUTION}: air compressibility matters here, ` +
        'so a constant drag coefficient no longer holds and the fitted Cd is an average over the flight.',
    );
  }
  if (reynoldsMax >= DRAG_CRISIS_RE[0] && reynoldsMin <= DRAG_CRISIS_RE[1]) {
    cautions.push(
      `Reynolds number runs from ${reynoldsMin.toExponential(1)} to ${reynoldsMax.toExponential(1)}, overlapping the ` +
        'sphere drag crisis (about 2e5 to 5e5): Cd can change sharply with speed, so a single Cd may not describe the whole flight.',
    );
  }
  return { reynoldsMin, reynoldsMax, machMax, cautions };
}
