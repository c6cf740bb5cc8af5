import { describe, expect, it } from 'vitest';
import { buildCalibrationTransform } from '../geometry/calibration-transform';
import { scaleWithUncertainty } from '../geometry/scale-uncertainty';
import { scaleRelativeUncertainty } from '../physics/fit-stages/uncertainty-budget';
import { rectangularStdUncertainty } from './gum';

// GUM, JCGM 100:2008 §4.3.7: a quantity known only to lie within ±a, all values
// equally likely, has standard uncertainty u = a/√3.
describe('a ±tolerance becomes a standard uncertainty once, by a/√3', () => {
  it('gives u = 0.577 mm for a 2 m bar stated as ±1 mm (GUM JCGM 100:2008 §4.3.7)', () => {
    expect(rectangularStdUncertainty(0.001) * 1000).toBeCloseTo(0.577, 3);
    // The scale reference carries it: relative u of the length times the length.
    const scale = scaleWithUncertainty({ lengthPx: 2000, lengthM: 2, lengthTolM: 0.001, endpointSigmaPx: 0 });
    expect(scale.lengthRel * 2 * 1000).toBeCloseTo(0.577, 3);
    expect(scale.relStdUncertainty).toBeCloseTo(0.001 / Math.sqrt(3) / 2, 15);
  });

  it('treats the tolerance the same in a calibration and in a fit input', () => {
    const reference = { lengthM: 2, lengthTolM: 0.001, endpointSigmaPx: 0.5 };
    const calibration = buildCalibrationTransform({
      scale: { p1: { u: 100, v: 600 }, p2: { u: 900, v: 600 }, ...reference },
      origin: { u: 100, v: 600 },
      level: { kind: 'angle', rollDeg: 0 },
      downrange: 'right',
      plane: null,
    });
    const fitInput = scaleRelativeUncertainty({ scale: { lengthPx: 800, ...reference } });
    expect(fitInput).toBe(calibration.scaleRelUncertainty);
    // Not the old reading of ±a as one standard uncertainty, which overstated it by √3.
    expect(fitInput).toBeLessThan(Math.hypot(0.001 / 2, (Math.SQRT2 * 0.5) / 800));
  });

  it('refuses a negative half-width', () => {
    expect(() => rectangularStdUncertainty(-1)).toThrow(RangeError);
  });
});
