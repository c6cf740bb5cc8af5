// The one pixel → world function with the camera corrections (lens, plane
// offset, level uncertainty). Outside references: the lens model is OpenCV's
// (checked in lens-distortion.test.ts), the offset factor the pinhole closed
// form (plane-offset.test.ts); here the chain is checked end to end against a
// camera built from those pieces in the opposite direction.
import { describe, expect, it } from 'vitest';
import { buildCalibrationTransform, type CalibrationGeometry } from './calibration-transform';
import { distort, lensModelForFrame } from './lens-distortion';
import { GeometryError, type PixelPoint } from './points';

const W = 1920, H = 1080;
const LENS = { k1: -0.2, k2: 0.04 };
const model = lensModelForFrame(W, H, LENS);
const PPM = 100; // flight plane, ideal pixels
const ORIGIN = { u: 300, v: 800 };
/** World (m) → what the camera shows: ideal pixels at PPM about ORIGIN, then the lens. */
const shown = (x: number, y: number): PixelPoint => distort(model, { u: ORIGIN.u + x * PPM, v: ORIGIN.v - y * PPM });

function geometry(more: Partial<CalibrationGeometry> = {}): CalibrationGeometry {
  // A 2 m bar 0.3 m nearer than a plane 10 m away: it shows 10/9.7 times longer.
  const barPx = 2 * PPM * (10 / 9.7);
  return {
    scale: { p1: distort(model, { u: 500, v: 900 }), p2: distort(model, { u: 500 + barPx, v: 900 }), lengthM: 2, lengthTolM: 0, endpointSigmaPx: 0.5 },
    origin: shown(0, 0),
    level: { kind: 'line', p1: distort(model, { u: 200, v: 1000 }), p2: distort(model, { u: 1700, v: 1000 }) },
    downrange: 'right',
    plane: null,
    lens: { ...LENS, frameWidthPx: W, frameHeightPx: H },
    planeOffset: { planeDistanceM: 10, planeDistanceTolM: 0, referenceOffsetM: 0.3, referenceOffsetTolM: 0 },
    ...more,
  };
}

describe('pixel → world with lens and plane offset', () => {
  it('recovers world points across the frame to 1e-9 m, and worldToImage inverts it', () => {
    const t = buildCalibrationTransform(geometry());
    expect(t.pixelsPerMetre).toBeCloseTo(PPM, 9);
    expect(t.rollDeg).toBeCloseTo(0, 9);
    for (const [x, y] of [[0, 0], [10, 5], [15.5, 1], [-2, 7.5], [7, -1.5]]) {
      const w = t.imageToWorld(shown(x, y));
      expect(w.x).toBeCloseTo(x, 9);
      expect(w.y).toBeCloseTo(y, 9);
      const back = t.worldToImage({ x, y });
      const p = shown(x, y);
      expect(back.u).toBeCloseTo(p.u, 8);
      expect(back.v).toBeCloseTo(p.v, 8);
    }
  });

  it('without the corrections the same clicks put a point 10 m downrange several centimetres off', () => {
    const plain = buildCalibrationTransform(geometry({ lens: null, planeOffset: null }));
    const w = plain.imageToWorld(shown(10, 5));
    expect(Math.hypot(w.x - 10, w.y - 5)).toBeGreaterThan(0.05);
  });

  it('the level line σ is carried through the lens; a stated roll uses its tolerance (GUM a/√3)', () => {
    const t = buildCalibrationTransform(geometry());
    // Ideal length 1500 px: √2·0.5/1500 rad before the lens stretch, a little more after it.
    expect(t.rollStdUncertaintyRad).toBeGreaterThan((Math.SQRT2 * 0.5) / 1500);
    expect(t.rollStdUncertaintyRad).toBeLessThan((1.5 * Math.SQRT2 * 0.5) / 1500);
    const stated = buildCalibrationTransform(geometry({ level: { kind: 'angle', rollDeg: 0 }, levelUncertainty: { rollTolDeg: 0.3 } }));
    expect(stated.rollStdUncertaintyRad).toBeCloseTo((0.3 / Math.sqrt(3)) * (Math.PI / 180), 15);
  });

  it('refuses folding coefficients and an offset larger than the distance, naming the field', () => {
    const field = (g: CalibrationGeometry) => {
      try { buildCalibrationTransform(g); } catch (e) { expect(e).toBeInstanceOf(GeometryError); return (e as GeometryError).field; }
      return null;
    };
    expect(field(geometry({ lens: { k1: -0.6, k2: 0, frameWidthPx: W, frameHeightPx: H } }))).toBe('lens.coefficients');
    expect(field(geometry({ planeOffset: { planeDistanceM: 3, planeDistanceTolM: 0, referenceOffsetM: 3.5, referenceOffsetTolM: 0 } }))).toBe('planeOffset.referenceOffsetM');
  });
});
