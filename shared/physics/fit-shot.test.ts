import { describe, expect, it } from 'vitest';
import { fitShot } from './fit-shot';
import { cdFromDragK, dragKFromCd } from './flight';
import { HANDBOOK_DRAG } from './handbook-drag';
import { syntheticMarks } from '../../tests/support/synthetic-shot';
import { FitInputError } from './validate-marks';

// A tennis-ball-sized sphere: d = 65 mm, m = 58 g, sea-level air.
const BALL = { massKg: 0.058, diameterM: 0.065, airDensityKgM3: 1.225 };
// Source: Hoerner, Fluid-Dynamic Drag — smooth sphere, subcritical Re: Cd about 0.47.
const SPHERE_CD = HANDBOOK_DRAG.find((e) => e.body === 'smooth sphere, subcritical')!.dragCoefficient;
const K_SPHERE = dragKFromCd(SPHERE_CD, BALL.diameterM, BALL.massKg, BALL.airDensityKgM3);

describe('fitShot synthetic round trip', () => {
  it('recovers speed, angle and Cd 0.47 of a sphere shot filmed at 240 fps', () => {
    expect(SPHERE_CD).toBe(0.47);
    const marks = syntheticMarks({ speedMps: 32, angleDeg: 38, dragK_perM: K_SPHERE, frameRateHz: 240, markCount: 150, noiseM: 0.002, seed: 7 });
    const r = fitShot({ marks, ...BALL });
    expect(r.model).toBe('quadratic-drag');
    expect(r.dragResolved).toBe(true);
    expect(r.dragVerdict).toMatch(/^drag resolved/);
    expect(r.launchSpeedMps.value).toBeCloseTo(32, 1);
    expect(r.launchAngleDeg.value).toBeCloseTo(38, 1);
    expect(Math.abs(r.dragCoefficient.value - 0.47)).toBeLessThan(4 * r.dragCoefficient.stdErr);
    expect(r.dragCoefficient.ci95[0]).toBeLessThan(0.47);
    expect(r.dragCoefficient.ci95[1]).toBeGreaterThan(0.47);
    expect(r.rmsResidualM).toBeGreaterThan(0.0015);
    expect(r.rmsResidualM).toBeLessThan(0.0025);
    expect(r.converged).toBe(true);
    expect(r.derived.dragLengthM).toBeCloseTo(1 / r.dragK_perM.value, 10);
  });

  it('exact marks give exact recovery and no outliers', () => {
    const marks = syntheticMarks({ speedMps: 25, angleDeg: 50, dragK_perM: K_SPHERE, frameRateHz: 500, markCount: 200, noiseM: 0, seed: 1 });
    const r = fitShot({ marks, ...BALL });
    expect(Math.abs(r.launchSpeedMps.value / 25 - 1)).toBeLessThan(1e-7);
    expect(Math.abs(r.dragK_perM.value / K_SPHERE - 1)).toBeLessThan(1e-5);
    expect(r.outlierCount).toBe(0);
  });

  it('flags a mark knocked 5 cm off the path', () => {
    const marks = syntheticMarks({ speedMps: 25, angleDeg: 45, dragK_perM: K_SPHERE, frameRateHz: 240, markCount: 80, noiseM: 0.002, seed: 3 });
    marks[40] = { ...marks[40], yM: marks[40].yM + 0.05 };
    const r = fitShot({ marks, ...BALL });
    expect(r.residuals[40].outlier).toBe(true);
    expect(r.outlierCount).toBeLessThanOrEqual(2);
    expect(r.cautions.some((c) => /robust standard deviations/.test(c))).toBe(true);
  });

  it('says drag is not resolved for a short, slow, dense shot', () => {
    // Heavy steel-like sphere, 0.15 s of flight: drag moves it by well under the noise.
    const marks = syntheticMarks({ speedMps: 8, angleDeg: 30, dragK_perM: 2e-4, frameRateHz: 240, markCount: 36, noiseM: 0.003, seed: 11 });
    const r = fitShot({ marks, massKg: 0.5, diameterM: 0.05, airDensityKgM3: 1.2 });
    expect(r.dragResolved).toBe(false);
    expect(r.model).toBe('drag-free');
    expect(r.dragVerdict).toMatch(/^drag not resolved from this clip: /);
    expect(r.dragK_perM.ci95[0]).toBeLessThan(0);
    expect(r.launchSpeedMps.value).toBeCloseTo(r.dragFree.launchSpeedMps.value, 12);
  });

  it('flags a wrong frame rate through the free-g check when drag is negligible', () => {
    // Clip filmed at 240 fps but stamped as 200 fps: times stretch by 1.2, so g looks 1.44 x smaller.
    const marks = syntheticMarks({ speedMps: 8, angleDeg: 30, dragK_perM: 0, frameRateHz: 240, markCount: 60, noiseM: 0.001, seed: 17 });
    const stretched = marks.map((m) => ({ ...m, tS: m.tS * 1.2 }));
    const r = fitShot({ marks: stretched, massKg: 0.5, diameterM: 0.05, airDensityKgM3: 1.2 });
    expect(r.dragFree.freeGravityMps2.value).toBeCloseTo(9.80665 / 1.44, 1);
    // The check now fits g inside the drag model (six parameters): same answer here, where drag is nil.
    expect(r.gravityCheck?.gravityMps2.value).toBeCloseTo(9.80665 / 1.44, 1);
    expect(r.cautions.some((c) => /check the capture frame rate and the scale/.test(c))).toBe(true);
    const honest = fitShot({ marks, massKg: 0.5, diameterM: 0.05, airDensityKgM3: 1.2 });
    expect(honest.cautions.some((c) => /frame rate/.test(c))).toBe(false);
  });

  it('does not raise the time-base caution on a draggy shot, where the drag-free parabola’s free g is far off', () => {
    const marks = syntheticMarks({ speedMps: 30, angleDeg: 40, dragK_perM: K_SPHERE, frameRateHz: 240, markCount: 120, noiseM: 0.001, seed: 21 });
    const r = fitShot({ marks, ...BALL });
    expect(r.dragResolved).toBe(true);
    expect(Math.abs(r.gravityCheck!.deviationSigmas)).toBeLessThan(3);
    expect(r.cautions.some((c) => /frame rate/.test(c))).toBe(false);
  });

  it('is deterministic and JSON-safe', () => {
    const marks = syntheticMarks({ speedMps: 30, angleDeg: 40, dragK_perM: K_SPHERE, frameRateHz: 300, markCount: 120, noiseM: 0.002, seed: 5 });
    const input = { marks, ...BALL, muzzle: { xM: -0.3, yM: 0.75 } };
    const a = JSON.stringify(fitShot(input));
    const b = JSON.stringify(fitShot(structuredClone(input)));
    expect(a).toBe(b);
    expect(JSON.parse(a)).toEqual(fitShot(input));
  });

  it('propagates scale, mass, diameter and density into the intervals and breaks them down', () => {
    const marks = syntheticMarks({ speedMps: 30, angleDeg: 40, dragK_perM: K_SPHERE, frameRateHz: 240, markCount: 120, noiseM: 0.002, seed: 9 });
    const base = fitShot({ marks, ...BALL });
    const r = fitShot({
      marks, ...BALL,
      uncertainties: {
        massKg: 0.00058, diameterM: 0.00065, airDensityKgM3: 0.01225,
        scale: { lengthM: 1, lengthTolM: 0.002, lengthPx: 1000, endpointSigmaPx: 1 },
      },
    });
    const by = Object.fromEntries(r.uncertaintyBreakdown.map((b) => [b.source, b]));
    // ±2 mm is a tolerance (rectangular, u = a/√3, GUM JCGM 100:2008 §4.3.7); each end point σ = 1 px.
    const uScale = Math.hypot(0.002 / Math.sqrt(3), Math.SQRT2 / 1000);
    // Speed's relative error from scale equals the scale's relative error.
    expect(by['scale'].launchSpeedMps / r.launchSpeedMps.value).toBeCloseTo(uScale, 12);
    // Cd = 2 m k / (rho A): 1 % in m -> 1 %, 1 % in d -> 2 %, 1 % in rho -> 1 %.
    expect(by['mass'].dragCoefficient / r.dragCoefficient.value).toBeCloseTo(0.01, 12);
    expect(by['diameter'].dragCoefficient / r.dragCoefficient.value).toBeCloseTo(0.02, 12);
    expect(by['air density'].dragCoefficient / r.dragCoefficient.value).toBeCloseTo(0.01, 12);
    expect(by['mass'].launchSpeedMps).toBe(0);
    const quad = Math.sqrt(r.uncertaintyBreakdown.reduce((a, b) => a + b.dragCoefficient ** 2, 0));
    expect(r.dragCoefficient.stdErr).toBeCloseTo(quad, 12);
    expect(r.dragCoefficient.ci95[1] - r.dragCoefficient.ci95[0]).toBeGreaterThan(base.dragCoefficient.ci95[1] - base.dragCoefficient.ci95[0]);
    expect(r.launchSpeedMps.value).toBe(base.launchSpeedMps.value);
  });

  it('back-extrapolates to the muzzle: speed there exceeds the first-mark speed', () => {
    // Marks begin 0.05 s after launch; the muzzle is the launch point itself.
    const marks = syntheticMarks({
      speedMps: 35, angleDeg: 35, dragK_perM: K_SPHERE, frameRateHz: 480, markCount: 160, noiseM: 0.001, seed: 21,
      x0M: 0, y0M: 1, firstMarkS: 0.05,
    });
    const r = fitShot({ marks, ...BALL, muzzle: { xM: 0, yM: 1 } });
    expect(r.muzzle).not.toBeNull();
    const m = r.muzzle!;
    expect(m.timeFromFirstMarkS).toBeCloseTo(-0.05, 3);
    expect(Math.abs(m.speedMps.value - 35)).toBeLessThan(4 * m.speedMps.stdErr + 0.01);
    expect(m.speedMps.value).toBeGreaterThan(r.launchSpeedMps.value);
    expect(Math.abs(m.heightMissM)).toBeLessThan(0.005);
  });

  it('cautions about compressibility near Mach 0.6 and about the sphere drag crisis', () => {
    const fast = syntheticMarks({ speedMps: 230, angleDeg: 10, dragK_perM: 0.002, frameRateHz: 1000, markCount: 100, noiseM: 0.003, seed: 2 });
    const r = fitShot({ marks: fast, massKg: 0.05, diameterM: 0.03, airDensityKgM3: 1.225 });
    expect(r.derived.machMax).toBeGreaterThan(0.6);
    expect(r.cautions.some((c) => /compressibility/.test(c))).toBe(true);
    expect(r.cautions.some((c) => /drag crisis/.test(c))).toBe(true);
    const slow = fitShot({ marks: syntheticMarks({ speedMps: 10, angleDeg: 30, dragK_perM: 0.01, frameRateHz: 240, markCount: 60, noiseM: 0.002, seed: 4 }), ...BALL });
    expect(slow.cautions.some((c) => /compressibility|drag crisis/.test(c))).toBe(false);
  });

  it('per-mark sigmas weight the fit: a noisier second half counts less', () => {
    const marks = syntheticMarks({ speedMps: 30, angleDeg: 40, dragK_perM: K_SPHERE, frameRateHz: 240, markCount: 120, noiseM: 0.002, seed: 13 });
    const noisy = marks.map((m, i) => (i < 60 ? { ...m, sigmaM: 0.002 } : { ...m, yM: m.yM + (i % 2 ? 0.02 : -0.02), sigmaM: 0.02 }));
    const weighted = fitShot({ marks: noisy, ...BALL });
    const unweighted = fitShot({ marks: noisy.map(({ sigmaM: _s, ...m }) => m), ...BALL });
    expect(Math.abs(weighted.launchSpeedMps.value - 30)).toBeLessThan(Math.abs(unweighted.launchSpeedMps.value - 30) + 0.05);
    expect(weighted.launchSpeedMps.stdErr).toBeLessThan(unweighted.launchSpeedMps.stdErr);
  });

  it('rejects bad input with a one-line message', () => {
    const marks = syntheticMarks({ speedMps: 20, angleDeg: 40, dragK_perM: 0.01, frameRateHz: 240, markCount: 20, noiseM: 0.001, seed: 1 });
    expect(() => fitShot({ marks: marks.slice(0, 4), ...BALL })).toThrow(FitInputError);
    const swapped = marks.map((m) => ({ ...m }));
    swapped[5].tS = swapped[4].tS;
    expect(() => fitShot({ marks: swapped, ...BALL })).toThrow(/not after the previous mark/);
    expect(() => fitShot({ marks, ...BALL, massKg: -1 })).toThrow(/massKg/);
  });

  it('Cd and k convert both ways: Cd = 2 m k / (rho A)', () => {
    expect(cdFromDragK(K_SPHERE, BALL.diameterM, BALL.massKg, BALL.airDensityKgM3)).toBeCloseTo(0.47, 14);
  });
});

describe('fitShot interval coverage over 200 seeded repeats', () => {
  it('each 95 % interval (speed, angle, k) holds the truth 90-98 % of the time', () => {
    const truth = { speedMps: 30, angleDeg: 40, k: K_SPHERE };
    let hitSpeed = 0, hitAngle = 0, hitK = 0;
    const repeats = 200;
    for (let seed = 1; seed <= repeats; seed++) {
      const marks = syntheticMarks({ speedMps: 30, angleDeg: 40, dragK_perM: truth.k, frameRateHz: 240, markCount: 60, noiseM: 0.003, seed: 1000 + seed });
      const r = fitShot({ marks, ...BALL });
      expect(r.dragResolved).toBe(true);
      const inside = (e: { ci95: [number, number] }, v: number) => e.ci95[0] <= v && v <= e.ci95[1];
      if (inside(r.launchSpeedMps, truth.speedMps)) hitSpeed++;
      if (inside(r.launchAngleDeg, truth.angleDeg)) hitAngle++;
      if (inside(r.dragK_perM, truth.k)) hitK++;
    }
    const rates = { speed: hitSpeed / repeats, angle: hitAngle / repeats, k: hitK / repeats };
    console.log(`95 % interval coverage over ${repeats} repeats: ${JSON.stringify(rates)}`);
    for (const rate of Object.values(rates)) {
      expect(rate).toBeGreaterThanOrEqual(0.9);
      expect(rate).toBeLessThanOrEqual(0.98);
    }
  }, 120_000); // generous timeout only: the machine is shared; speed is measured in scripts/bench-physics.ts
});
