import { LuDecomposition, Matrix, inverse } from 'ml-matrix';
import { GeometryError, type PixelPoint } from './points';

/** Row-major 3×3 projective matrix [h11 h12 h13 h21 h22 h23 h31 h32 h33], mapping (u, v, 1) up to scale. */
export type Homography = readonly number[];

export function applyHomography(h: Homography, p: PixelPoint): PixelPoint {
  const w = h[6] * p.u + h[7] * p.v + h[8];
  if (Math.abs(w) < 1e-15) throw new GeometryError('The point lies on the horizon of the plane correction.', 'plane');
  return { u: (h[0] * p.u + h[1] * p.v + h[2]) / w, v: (h[3] * p.u + h[4] * p.v + h[5]) / w };
}

/** Scale so h33 = 1 (the normal form of the 8-parameter DLT), or unit Frobenius norm when h33 ≈ 0. */
export function normaliseHomography(h: Homography): number[] {
  const s = Math.abs(h[8]) > 1e-12 ? h[8] : Math.hypot(...h);
  return h.map((x) => x / s);
}

export function invertHomography(h: Homography): number[] {
  const m = new Matrix([
    [h[0], h[1], h[2]],
    [h[3], h[4], h[5]],
    [h[6], h[7], h[8]],
  ]);
  return normaliseHomography(inverse(m).to1DArray());
}

export function multiplyHomography(a: Homography, b: Homography): number[] {
  const out: number[] = [];
  for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) out.push(a[r * 3] * b[c] + a[r * 3 + 1] * b[3 + c] + a[r * 3 + 2] * b[6 + c]);
  return out;
}

/**
 * Hartley's normalisation (Hartley & Zisserman, Multiple View Geometry, 2nd ed., §4.4):
 * move the centroid to 0 and scale the mean distance to √2, so the DLT system is well conditioned
 * whatever the image size.
 */
function normalisingTransform(points: readonly PixelPoint[]): number[] {
  const cu = points.reduce((s, p) => s + p.u, 0) / points.length;
  const cv = points.reduce((s, p) => s + p.v, 0) / points.length;
  const meanDist = points.reduce((s, p) => s + Math.hypot(p.u - cu, p.v - cv), 0) / points.length;
  const s = Math.SQRT2 / meanDist;
  return [s, 0, -s * cu, 0, s, -s * cv, 0, 0, 1];
}

/** Twice the signed area of triangle abc. */
function cross(a: PixelPoint, b: PixelPoint, c: PixelPoint): number {
  return (b.u - a.u) * (c.v - a.v) - (b.v - a.v) * (c.u - a.u);
}

/**
 * Four points define a homography only if no three are collinear. We also
 * require a convex quadrilateral in the given order: a crossed order (two
 * corners swapped) is almost always a clicking mistake and would fold the plane.
 */
export function checkQuadrilateral(points: readonly PixelPoint[], field: string): void {
  const size = Math.max(...points.map((p, i) => Math.hypot(p.u - points[(i + 2) % 4].u, p.v - points[(i + 2) % 4].v)));
  if (!(size > 0)) throw new GeometryError('The four corners coincide.', field);
  const turns = [0, 1, 2, 3].map((i) => cross(points[i], points[(i + 1) % 4], points[(i + 2) % 4]));
  // Relative area threshold: a corner triangle thinner than 1e-3 of the quad's size squared is collinear for our purpose.
  if (turns.some((t) => Math.abs(t) < 1e-3 * size * size)) {
    throw new GeometryError('Three of the four corners lie (almost) on one line; click the rectangle’s four corners.', field);
  }
  if (!turns.every((t) => Math.sign(t) === Math.sign(turns[0]))) {
    throw new GeometryError('The corners cross over: give them in order top-left, top-right, bottom-right, bottom-left.', field);
  }
}

/**
 * Direct linear transform from exactly four correspondences: with h33 = 1
 * each pair gives two linear equations in the other eight entries
 * (Hartley & Zisserman §4.1), solved as an 8×8 system after normalisation.
 */
export function solveHomography(src: readonly PixelPoint[], dst: readonly PixelPoint[], field = 'plane.corners'): number[] {
  if (src.length !== 4 || dst.length !== 4) throw new GeometryError('A plane correction needs exactly four corners.', field);
  checkQuadrilateral(src, field);
  checkQuadrilateral(dst, field);
  const ts = normalisingTransform(src);
  const td = normalisingTransform(dst);
  const a: number[][] = [];
  const b: number[] = [];
  for (let i = 0; i < 4; i++) {
    const s = applyAffine(ts, src[i]);
    const d = applyAffine(td, dst[i]);
    a.push([s.u, s.v, 1, 0, 0, 0, -s.u * d.u, -s.v * d.u]);
    b.push(d.u);
    a.push([0, 0, 0, s.u, s.v, 1, -s.u * d.v, -s.v * d.v]);
    b.push(d.v);
  }
  const lu = new LuDecomposition(new Matrix(a));
  if (lu.isSingular() || Math.abs(lu.determinant) < 1e-12) {
    throw new GeometryError('The plane correction is degenerate (the corners do not define a plane view).', field);
  }
  const x = lu.solve(Matrix.columnVector(b)).to1DArray();
  const hn = [...x, 1];
  // H = Td⁻¹ · Hn · Ts
  return normaliseHomography(multiplyHomography(invertHomography(td), multiplyHomography(hn, ts)));
}

function applyAffine(t: readonly number[], p: PixelPoint): PixelPoint {
  return { u: t[0] * p.u + t[1] * p.v + t[2], v: t[3] * p.u + t[4] * p.v + t[5] };
}
