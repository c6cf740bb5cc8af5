import { describe, expect, it } from 'vitest';
import {
  buildCalibrationTransform,
  rollFromLevelLine,
  similarityToImage,
  similarityToWorld,
  type CalibrationGeometry,
} from './calibration-transform';
import { applyHomography } from './homography';
import { GeometryError } from './points';
import { mulberry32 } from '../random/prng';

const SQRT3 = Math.sqrt(3);

function level0(): CalibrationGeometry {
  return {
    scale: { p1: { u: 100, v: 500 }, p2: { u: 300, v: 500 }, lengthM: 1, lengthTolM: 0, endpointSigmaPx: 0 },
    origin: { u: 100, v: 300 },
    level: { kind: 'angle', rollDeg: 0 },
    downrange: 'right',
    plane: null,
  };
}

describe('frame pixels → world metres, closed forms', () => {
  it('pure scale: 200 px per 1.000 m, origin (100,300), level 0 → (300,100) is (1, 1) m', () => {
    // By hand: Δu = 200 px → 1 m right; Δv = −200 px (up on screen) → 1 m up.
    const t = buildCalibrationTransform(level0());
    expect(t.pixelsPerMetre).toBe(200);
    const w = t.imageToWorld({ u: 300, v: 100 });
    expect(w.x).toBeCloseTo(1, 12);
    expect(w.y).toBeCloseTo(1, 12);
    const below = t.imageToWorld({ u: 50, v: 400 });
    expect(below.x).toBeCloseTo(-0.25, 12);
    expect(below.y).toBeCloseTo(-0.5, 12);
  });

  it('roll 90°: world x points up the screen, so screen-right is world −y', () => {
    const sim = { origin: { u: 100, v: 300 }, pixelsPerMetre: 200, rollRad: Math.PI / 2, mirrorX: false };
    const up = similarityToWorld(sim, { u: 100, v: 100 });
    expect(up.x).toBeCloseTo(1, 12);
    expect(up.y).toBeCloseTo(0, 12);
    const right = similarityToWorld(sim, { u: 300, v: 300 });
    expect(right.x).toBeCloseTo(0, 12);
    expect(right.y).toBeCloseTo(-1, 12);
  });

  it('roll 30°: exact sin 30° = 1/2, cos 30° = √3/2', () => {
    const sim = { origin: { u: 400, v: 300 }, pixelsPerMetre: 100, rollRad: Math.PI / 6, mirrorX: false };
    // World (1, 0) lies along the rolled horizon: 100·(√3/2, 1/2) px, screen-up is −v.
    const p = similarityToImage(sim, { x: 1, y: 0 });
    expect(p.u).toBeCloseTo(400 + 50 * SQRT3, 10);
    expect(p.v).toBeCloseTo(300 - 50, 10);
    // World (0, 1) is perpendicular: 100·(−1/2, √3/2).
    const q = similarityToImage(sim, { x: 0, y: 1 });
    expect(q.u).toBeCloseTo(400 - 50, 10);
    expect(q.v).toBeCloseTo(300 - 50 * SQRT3, 10);
    const back = similarityToWorld(sim, { u: 400 + 50 * SQRT3, v: 250 });
    expect(back.x).toBeCloseTo(1, 12);
    expect(back.y).toBeCloseTo(0, 12);
  });

  it('level line at 30° gives roll 30° whichever point is clicked first', () => {
    const a = { u: 10, v: 150 };
    const b = { u: 10 + 100 * SQRT3, v: 50 }; // rises 100 px over 100√3 px: tan 30°
    expect(rollFromLevelLine(a, b)).toBeCloseTo(30, 12);
    expect(rollFromLevelLine(b, a)).toBeCloseTo(30, 12);
    expect(rollFromLevelLine({ u: 0, v: 0 }, { u: 100, v: 100 })).toBeCloseTo(-45, 12);
  });

  it('level line drives the transform: a point on the level line has y = 0', () => {
    const g = { ...level0(), level: { kind: 'line' as const, p1: { u: 100, v: 300 }, p2: { u: 100 + 100 * SQRT3, v: 200 } } };
    const t = buildCalibrationTransform(g);
    expect(t.rollDeg).toBeCloseTo(30, 12);
    const w = t.imageToWorld({ u: 100 + 200 * SQRT3, v: 100 }); // 400 px along the line = 2 m
    expect(w.x).toBeCloseTo(2, 12);
    expect(w.y).toBeCloseTo(0, 12);
  });

  it('downrange left mirrors x only', () => {
    const t = buildCalibrationTransform({ ...level0(), downrange: 'left' });
    const w = t.imageToWorld({ u: 300, v: 100 });
    expect(w.x).toBeCloseTo(-1, 12);
    expect(w.y).toBeCloseTo(1, 12);
  });

  it('round trip world → image → world within 1e-9 (no plane correction, roll 7.3°, left)', () => {
    const t = buildCalibrationTransform({ ...level0(), level: { kind: 'angle', rollDeg: 7.3 }, downrange: 'left' });
    const rand = mulberry32(7);
    for (let i = 0; i < 200; i++) {
      const w = { x: rand() * 20 - 5, y: rand() * 8 - 1 };
      const back = t.imageToWorld(t.worldToImage(w));
      expect(Math.abs(back.x - w.x)).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(back.y - w.y)).toBeLessThanOrEqual(1e-9);
    }
  });
});

describe('plane correction recovers a known camera', () => {
  // A camera not square to the flight plane, written as a known homography G
  // from world metres (x, y up) to frame pixels (v down). Everything the
  // analyst clicks is generated through G, so the right answer is the world
  // point we started from.
  const G = [420, 35, 120, 25, -390, 640, 0.06, 0.015, 1];
  const toImage = (x: number, y: number) => applyHomography(G, { u: x, v: y });

  function cameraCalibration(): CalibrationGeometry {
    return {
      scale: { p1: toImage(0.5, 0.2), p2: toImage(1.5, 0.2), lengthM: 1, lengthTolM: 0.001, endpointSigmaPx: 0.5 },
      origin: toImage(0, 0),
      level: { kind: 'line', p1: toImage(0.1, 0.7), p2: toImage(1.9, 0.7) },
      downrange: 'right',
      plane: { corners: [toImage(0, 1), toImage(2, 1), toImage(2, 0), toImage(0, 0)], widthM: 2, heightM: 1 },
    };
  }

  it('maps frame pixels to the world points they were made from', () => {
    const t = buildCalibrationTransform(cameraCalibration());
    expect(t.rollDeg).toBeCloseTo(0, 9);
    for (const [x, y] of [
      [0, 0],
      [1, 1],
      [3.5, 2.2],
      [-0.7, 0.4],
    ]) {
      const w = t.imageToWorld(toImage(x, y));
      expect(w.x).toBeCloseTo(x, 9);
      expect(w.y).toBeCloseTo(y, 9);
    }
  });

  it('round trip world → image → world within 1e-9', () => {
    const t = buildCalibrationTransform(cameraCalibration());
    const rand = mulberry32(11);
    for (let i = 0; i < 200; i++) {
      const w = { x: rand() * 4 - 0.5, y: rand() * 2 };
      const back = t.imageToWorld(t.worldToImage(w));
      expect(Math.abs(back.x - w.x)).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(back.y - w.y)).toBeLessThanOrEqual(1e-9);
    }
  });

  it('rejects mirrored or crossed corner orders', () => {
    const g = cameraCalibration();
    const [tl, tr, br, bl] = g.plane!.corners;
    expect(() => buildCalibrationTransform({ ...g, plane: { ...g.plane!, corners: [tr, tl, bl, br] } })).toThrow(/mirror/);
    expect(() => buildCalibrationTransform({ ...g, plane: { ...g.plane!, corners: [tl, br, tr, bl] } })).toThrow(GeometryError);
  });

  it('rejects coincident scale points and a tolerance not smaller than the length', () => {
    const g = level0();
    expect(() => buildCalibrationTransform({ ...g, scale: { ...g.scale, p2: { u: 100.2, v: 500 } } })).toThrow(GeometryError);
    expect(() => buildCalibrationTransform({ ...g, scale: { ...g.scale, lengthTolM: 1 } })).toThrow(/tolerance/);
  });
});
