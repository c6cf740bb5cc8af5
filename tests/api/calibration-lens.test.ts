// Calibration with the camera corrections: lens (fitted from straight edges or
// stated), scale reference off the flight plane, level uncertainty. Bad input
// is a plain 400 problem+json on the field at fault and stores nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLICK_SIGMA_PX } from '../../shared/defaults';
import { distort, lensModelForFrame } from '../../shared/geometry/lens-distortion';
import type { PixelPoint } from '../../shared/geometry/points';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { SIMPLE_CALIBRATION, createMarkingClip, demoTeamId } from '../support/marking-clip';
import { expectProblem, fieldPaths } from '../support/problem';
import { createTestApp, signInAs, type TestApp } from '../support/test-app';

let t: TestApp;
let teamId: string;
let analyst: Awaited<ReturnType<typeof signInAs>>;

beforeAll(async () => {
  t = await createTestApp();
  teamId = await demoTeamId(t);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
});
afterAll(() => t.close());

const calibrationsOf = (clipId: string) => `/api/teams/${teamId}/clips/${clipId}/calibrations`;

// The test clip is 640×480; edges straight in the world, bent by a known barrel lens.
const W = 640, H = 480;
function bent(k1: number, a: PixelPoint, b: PixelPoint, n = 9): PixelPoint[] {
  const m = lensModelForFrame(W, H, { k1, k2: 0 });
  return Array.from({ length: n }, (_, i) => distort(m, { u: a.u + ((b.u - a.u) * i) / (n - 1), v: a.v + ((b.v - a.v) * i) / (n - 1) }));
}
const EDGES = (k1: number) => [
  bent(k1, { u: 20, v: 450 }, { u: 620, v: 460 }),
  bent(k1, { u: 30, v: 30 }, { u: 610, v: 20 }),
  bent(k1, { u: 40, v: 20 }, { u: 50, v: 460 }),
  bent(k1, { u: 600, v: 20 }, { u: 590, v: 460 }),
];

async function nothingStored(clipId: string) {
  const current = await analyst.get(`${calibrationsOf(clipId)}/current`);
  expect(current.body).toEqual({ calibration: null });
}

describe('lens correction in the calibration', () => {
  it('fits k1 from clicked straight edges and returns the model, coefficients, their uncertainties and the residual', async () => {
    const clipId = await createMarkingClip(t, analyst, teamId);
    const res = await analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, lens: { straightLines: EDGES(-0.12), clickSigmaPx: 0.5 } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const lens = res.body.lens;
    expect(lens).toMatchObject({ model: 'brown-conrady-radial', source: 'straight-lines', frameWidthPx: W, frameHeightPx: H });
    // Exact clicks of a k1-only lens: k1 comes back, k2 ~ 0 (closed-form truth, lens-distortion.ts).
    expect(lens.k1).toBeCloseTo(-0.12, 5);
    expect(Math.abs(lens.k2)).toBeLessThan(1e-5);
    expect(lens.residualRmsPx).toBeLessThan(1e-3);
    expect(lens.k1StdUnc).toBeGreaterThan(0);
    expect(lens.straightLines).toHaveLength(4);
    // The scale end points are corrected too: pixels per metre differ from the plain 200.
    expect(res.body.pixelsPerMetre).not.toBeCloseTo(200, 3);
    const current = await analyst.get(`${calibrationsOf(clipId)}/current`);
    expect(current.body.calibration.lens.k1).toBeCloseTo(-0.12, 5);
  });

  it('takes known coefficients (a lens profile measured once) as stated', async () => {
    const clipId = await createMarkingClip(t, analyst, teamId);
    const res = await analyst.post(calibrationsOf(clipId)).send({
      ...SIMPLE_CALIBRATION, lens: { coefficients: { k1: -0.08, k2: 0.01, k1StdUnc: 0.002, k2StdUnc: 0.001, k1k2Correlation: -0.9 } },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.lens).toMatchObject({ source: 'coefficients', k1: -0.08, k2: 0.01, k1StdUnc: 0.002, k1k2Correlation: -0.9, residualRmsPx: null });
  });

  it('moves the scale to the flight plane: pixels per metre × (D − δ)/D, with the factor and its uncertainty', async () => {
    const clipId = await createMarkingClip(t, analyst, teamId);
    const res = await analyst.post(calibrationsOf(clipId)).send({
      ...SIMPLE_CALIBRATION, planeOffset: { planeDistanceM: 10, planeDistanceTolM: 0.5, referenceOffsetM: 0.2, referenceOffsetTolM: 0.05 },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // Pinhole closed form: 200 px/m at the reference, 9.8/10 of it in the plane.
    expect(res.body.pixelsPerMetre).toBeCloseTo(196, 9);
    expect(res.body.planeOffset.factor).toBeCloseTo(0.98, 12);
    // GUM: √((0.05/√3/10)² + (0.2·0.5/√3/100)²) / 0.98.
    expect(res.body.planeOffset.relStdUncertainty).toBeCloseTo(Math.hypot(0.05 / Math.sqrt(3) / 10, (0.2 * 0.5) / Math.sqrt(3) / 100) / 0.98, 12);
  });

  it('states the roll uncertainty: a level line from its click σ, a stated roll from its tolerance', async () => {
    const clipId = await createMarkingClip(t, analyst, teamId);
    const line = await analyst.post(calibrationsOf(clipId)).send({
      ...SIMPLE_CALIBRATION, level: { kind: 'line', p1: { u: 100, v: 400 }, p2: { u: 500, v: 400 } }, levelUncertainty: { endpointSigmaPx: 0.5 },
    });
    expect(line.status).toBe(201);
    // √2 · 0.5 / 400 rad.
    expect(line.body.rollStdUncertaintyDeg).toBeCloseTo((Math.SQRT2 * 0.5 / 400) * (180 / Math.PI), 9);
    const stated = await analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, levelUncertainty: { rollTolDeg: 0.5 } });
    expect(stated.body.rollStdUncertaintyDeg).toBeCloseTo(0.5 / Math.sqrt(3), 12);
  });

  it('echoes the stated level uncertainty as stored, defaults filled in, in the answer and the version list', async () => {
    const clipId = await createMarkingClip(t, analyst, teamId);
    const line = await analyst.post(calibrationsOf(clipId)).send({
      ...SIMPLE_CALIBRATION, level: { kind: 'line', p1: { u: 100, v: 400 }, p2: { u: 500, v: 404 } }, levelUncertainty: { endpointSigmaPx: 0.8 },
    });
    expect(line.status, JSON.stringify(line.body)).toBe(201);
    expect(line.body.levelUncertainty).toEqual({ endpointSigmaPx: 0.8 });
    // A tolerance meant for a stated roll says nothing about a line's clicks: the line keeps the usual click σ.
    const lineDefault = await analyst.post(calibrationsOf(clipId)).send({
      ...SIMPLE_CALIBRATION, level: { kind: 'line', p1: { u: 100, v: 400 }, p2: { u: 500, v: 404 } }, levelUncertainty: { rollTolDeg: 2 },
    });
    expect(lineDefault.body.levelUncertainty).toEqual({ endpointSigmaPx: CLICK_SIGMA_PX });
    const stated = await analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, levelUncertainty: { rollTolDeg: 0.25 } });
    expect(stated.body.levelUncertainty).toEqual({ rollTolDeg: 0.25 });
    const none = await analyst.post(calibrationsOf(clipId)).send(SIMPLE_CALIBRATION);
    expect(none.body.levelUncertainty).toEqual({ rollTolDeg: 0 });
    const listed = await analyst.get(calibrationsOf(clipId));
    expect(listed.body.calibrations.map((c: { levelUncertainty: unknown }) => c.levelUncertainty)).toEqual([
      { rollTolDeg: 0 }, { rollTolDeg: 0.25 }, { endpointSigmaPx: CLICK_SIGMA_PX }, { endpointSigmaPx: 0.8 },
    ]);
  });
});

describe('bad camera input: 400 problem+json on the field, nothing stored', () => {
  const refuse = async (more: object, path: RegExp) => {
    const clipId = await createMarkingClip(t, analyst, teamId);
    const res = await analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, ...more });
    expectProblem(res, 400);
    expect(fieldPaths(res).some((p) => path.test(p)), JSON.stringify(res.body)).toBe(true);
    await nothingStored(clipId);
    return res;
  };
  it('one straight edge', () => refuse({ lens: { straightLines: EDGES(-0.1).slice(0, 1) } }, /^body\.lens\.straightLines/));
  it('an edge of two points', () => refuse({ lens: { straightLines: [EDGES(-0.1)[0], EDGES(-0.1)[1].slice(0, 2)] } }, /^body\.lens\.straightLines\.1/));
  it('edges that all run through the centre', async () => {
    const res = await refuse({
      lens: { straightLines: [[{ u: 20, v: 20 }, { u: 320, v: 240 }, { u: 620, v: 460 }], [{ u: 320, v: 10 }, { u: 320, v: 240 }, { u: 320, v: 470 }]] },
    }, /^body\.lens\.straightLines/);
    expect(res.body.detail).toMatch(/centre/);
  });
  it('both edges and coefficients', () => refuse({ lens: { straightLines: EDGES(-0.1), coefficients: { k1: -0.1 } } }, /^body\.lens/));
  it('non-finite coefficients', () => refuse({ lens: { coefficients: { k1: 'NaN' } } }, /^body\.lens\.coefficients\.k1/));
  it('absurd coefficients (outside ±2)', () => refuse({ lens: { coefficients: { k1: 7 } } }, /^body\.lens\.coefficients\.k1/));
  it('coefficients that fold the picture', async () => {
    const res = await refuse({ lens: { coefficients: { k1: -0.6 } } }, /^body\.lens\.coefficients/);
    expect(res.body.detail).toMatch(/fold/);
  });
  it('a reference offset larger than the plane distance', async () => {
    const res = await refuse({ planeOffset: { planeDistanceM: 2, referenceOffsetM: 3 } }, /^body\.planeOffset\.referenceOffsetM/);
    expect(res.body.detail).toMatch(/camera/);
  });
});
