import { createRequire } from 'node:module';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  coefficientProblem,
  distort,
  distortRadius,
  lensModelForFrame,
  undistort,
  undistortRadius,
  type LensModel,
} from './lens-distortion';

// Outside reference: OpenCV 4.12 (npm @techstark/opencv-js), whose camera model
// distorts normalised ideal coordinates by x_d = x (1 + k1 r² + k2 r⁴ + k3 r⁶)
// (docs.opencv.org, "Camera Calibration and 3D Reconstruction").
// initUndistortRectifyMap with newCameraMatrix = cameraMatrix gives, for every
// ideal pixel of the output grid, the source pixel it comes from in the
// distorted frame, i.e. OpenCV's distort(); projectPoints does the same for
// arbitrary points. This build has no undistortPoints, so undistort() is
// checked as the inverse of OpenCV's map.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Cv = any;
let cv: Cv;

/**
 * OpenCV for this test (shared/ may not import the server's loader,
 * server/vision/opencv.ts, which does the same): the Emscripten module carries a
 * `then`, so it is awaited through onRuntimeInitialized and the `then` dropped.
 */
function loadOpenCv(): Promise<Cv> {
  const mod = createRequire(import.meta.url)('@techstark/opencv-js') as Cv;
  return new Promise((resolve) => {
    const done = () => { delete mod.then; resolve(mod); };
    if (typeof mod.Mat === 'function' && mod.calledRun) done();
    else mod.onRuntimeInitialized = done;
  });
}

beforeAll(async () => { cv = await loadOpenCv(); }, 60_000);

const W = 1280;
const H = 720;

/** OpenCV's remap tables for our lens: mapX/mapY at ideal pixel (u, v) = distorted source pixel. */
function openCvMaps(model: LensModel, width: number, height: number) {
  const R = model.normRadiusPx;
  const K = cv.matFromArray(3, 3, cv.CV_64F, [R, 0, model.centre.u, 0, R, model.centre.v, 0, 0, 1]);
  const D = cv.matFromArray(1, 5, cv.CV_64F, [model.k1, model.k2, 0, 0, 0]);
  const I = cv.Mat.eye(3, 3, cv.CV_64F);
  const mapX = new cv.Mat();
  const mapY = new cv.Mat();
  cv.initUndistortRectifyMap(K, D, I, K, new cv.Size(width, height), cv.CV_32FC1, mapX, mapY);
  const xs = Float32Array.from(mapX.data32F as Float32Array);
  const ys = Float32Array.from(mapY.data32F as Float32Array);
  for (const m of [K, D, I, mapX, mapY]) m.delete();
  return { xs, ys };
}

function openCvProjectPoints(model: LensModel, ideal: { u: number; v: number }[]) {
  const R = model.normRadiusPx;
  const K = cv.matFromArray(3, 3, cv.CV_64F, [R, 0, model.centre.u, 0, R, model.centre.v, 0, 0, 1]);
  const D = cv.matFromArray(1, 5, cv.CV_64F, [model.k1, model.k2, 0, 0, 0]);
  // Points on the plane z = 1 in front of an unrotated camera: (x, y) are the normalised ideal coordinates.
  const obj = cv.matFromArray(ideal.length, 1, cv.CV_64FC3, ideal.flatMap((p) => [
    (p.u - model.centre.u) / R, (p.v - model.centre.v) / R, 1,
  ]));
  const rvec = cv.matFromArray(3, 1, cv.CV_64F, [0, 0, 0]);
  const tvec = cv.matFromArray(3, 1, cv.CV_64F, [0, 0, 0]);
  const out = new cv.Mat();
  cv.projectPoints(obj, rvec, tvec, K, D, out);
  const d = Float64Array.from(out.data64F as Float64Array);
  for (const m of [K, D, obj, rvec, tvec, out]) m.delete();
  return ideal.map((_, i) => ({ u: d[2 * i], v: d[2 * i + 1] }));
}

// Coefficients of the kind seen on a wide action-camera lens (barrel) and a
// phone telephoto (mild pincushion); from memory of typical calibrations, not a
// particular product's profile.
const LENSES = [
  { name: 'strong barrel', k1: -0.22, k2: 0.05 },
  { name: 'mild barrel', k1: -0.06, k2: 0 },
  { name: 'pincushion', k1: 0.08, k2: -0.02 },
];

describe('distort() against OpenCV initUndistortRectifyMap', () => {
  for (const lens of LENSES) {
    it(`${lens.name}: every 16th pixel of a ${W}×${H} grid agrees to 0.01 px, and undistort() inverts OpenCV's map`, () => {
      const model = lensModelForFrame(W, H, lens);
      const { xs, ys } = openCvMaps(model, W, H);
      let worstDistort = 0;
      let worstUndistort = 0;
      let checked = 0;
      for (let v = 0; v < H; v += 16) {
        for (let u = 0; u < W; u += 16) {
          const i = v * W + u;
          const ours = distort(model, { u, v });
          worstDistort = Math.max(worstDistort, Math.hypot(ours.u - xs[i], ours.v - ys[i]));
          const back = undistort(model, { u: xs[i], v: ys[i] });
          worstUndistort = Math.max(worstUndistort, Math.hypot(back.u - u, back.v - v));
          checked++;
        }
      }
      expect(checked).toBeGreaterThan(3000);
      // OpenCV writes the map as 32-bit floats: ~1e-4 px at these coordinates.
      expect(worstDistort).toBeLessThan(0.01);
      expect(worstUndistort).toBeLessThan(0.01);
      // The distortion is real: the frame corner moves by whole pixels.
      const corner = distort(model, { u: 0, v: 0 });
      expect(Math.hypot(corner.u, corner.v)).toBeGreaterThan(10);
    });
  }

  it('projectPoints (double precision) agrees to 1e-6 px at off-grid points', () => {
    const model = lensModelForFrame(1920, 1080, { k1: -0.18, k2: 0.03 });
    const pts = Array.from({ length: 50 }, (_, i) => ({ u: 13.37 + 37.9 * i, v: 1080 - 21.3 * i - 0.25 }));
    const cvPts = openCvProjectPoints(model, pts);
    pts.forEach((p, i) => {
      const ours = distort(model, p);
      expect(Math.abs(ours.u - cvPts[i].u)).toBeLessThan(1e-6);
      expect(Math.abs(ours.v - cvPts[i].v)).toBeLessThan(1e-6);
    });
  });
});

describe('undistort() is the exact inverse of distort()', () => {
  it('round trip to 1e-9 px over the whole frame', () => {
    const model = lensModelForFrame(W, H, { k1: -0.25, k2: 0.06 });
    for (let v = -2; v <= H + 2; v += 37.5) {
      for (let u = -2; u <= W + 2; u += 41.25) {
        const back = distort(model, undistort(model, { u, v }));
        expect(Math.abs(back.u - u)).toBeLessThan(1e-9);
        expect(Math.abs(back.v - v)).toBeLessThan(1e-9);
      }
    }
  });

  it('the centre is fixed, and with zero coefficients nothing moves', () => {
    const model = lensModelForFrame(W, H, { k1: -0.2, k2: 0 });
    expect(undistort(model, { u: W / 2, v: H / 2 })).toEqual({ u: W / 2, v: H / 2 });
    const none = lensModelForFrame(W, H, { k1: 0, k2: 0 });
    expect(undistort(none, { u: 12.5, v: 700 })).toEqual({ u: 12.5, v: 700 });
  });

  it('barrel pulls the corner in: the ideal corner lies outside the frame', () => {
    // Closed form for k2 = 0: r_d = r (1 + k1 r²); with k1 = −0.1, r = 1 gives r_d = 0.9.
    expect(distortRadius({ k1: -0.1, k2: 0 }, 1)).toBeCloseTo(0.9, 15);
    expect(undistortRadius({ k1: -0.1, k2: 0 }, 0.9)).toBeCloseTo(1, 12);
  });
});

describe('coefficientProblem', () => {
  it('accepts ordinary lenses', () => {
    for (const lens of LENSES) expect(coefficientProblem(lens)).toBeNull();
    expect(coefficientProblem({ k1: 0, k2: 0 })).toBeNull();
  });
  it('refuses non-finite, folding and fisheye-strength coefficients with a plain message', () => {
    expect(coefficientProblem({ k1: Number.NaN, k2: 0 })).toMatch(/finite/);
    expect(coefficientProblem({ k1: Number.POSITIVE_INFINITY, k2: 0 })).toMatch(/finite/);
    // k1 = −0.5: slope 1 − 1.5 r² is zero at r = 0.816 while r_d is still 0.54: the image folds.
    expect(coefficientProblem({ k1: -0.5, k2: 0 })).toMatch(/fold/);
    // k1 = 8: r + 8 r³ = 1 at r ≈ 0.42, the corner moved by 58 %.
    expect(coefficientProblem({ k1: 8, k2: 0 })).toMatch(/fisheye/);
  });
});
