// Weighted linear least squares by Householder QR (stable for the nearly
// collinear time columns of short clips, and cheap for the few columns a
// shot fit has), plus the helpers the nonlinear fit uses for its covariance.
import { Matrix, SingularValueDecomposition } from 'ml-matrix';

export interface LinearFit {
  params: number[];
  covariance: number[][];
  residuals: number[];
  rss: number;
  dof: number;
}

/**
 * In-place Householder QR of a column-major n x p matrix (cols[j][i]).
 * Applies the same reflections to rhs if given. Returns R (p x p, upper) as rows.
 */
export function householderQr(cols: Float64Array[], rhs?: Float64Array): number[][] {
  const p = cols.length;
  const n = cols[0].length;
  for (let k = 0; k < p; k++) {
    const a = cols[k];
    let norm = 0;
    for (let i = k; i < n; i++) norm += a[i] * a[i];
    norm = Math.sqrt(norm);
    if (norm === 0) continue;
    const alpha = a[k] > 0 ? -norm : norm;
    // v = a - alpha e_k, stored in a[k..n-1]; H = I - 2 v v^T / (v^T v)
    a[k] -= alpha;
    let vv = 0;
    for (let i = k; i < n; i++) vv += a[i] * a[i];
    for (let j = k + 1; j <= p; j++) {
      const c = j < p ? cols[j] : rhs;
      if (!c) continue;
      let dot = 0;
      for (let i = k; i < n; i++) dot += a[i] * c[i];
      const f = (2 * dot) / vv;
      for (let i = k; i < n; i++) c[i] -= f * a[i];
    }
    // Store the diagonal of R; the reflector itself is no longer needed.
    a[k] = alpha;
    for (let i = k + 1; i < n; i++) a[i] = 0;
  }
  return Array.from({ length: p }, (_, i) => Array.from({ length: p }, (_, j) => (j >= i ? cols[j][i] : 0)));
}

/**
 * (R^T R)^-1 via the SVD of the small triangle R, dropping directions whose
 * singular value is below 1e-15 of the largest. Returns the inverse condition too.
 */
export function inverseNormalFromR(R: number[][]): { inverse: number[][]; inverseCondition: number } {
  const p = R.length;
  const svd = new SingularValueDecomposition(new Matrix(R), { computeLeftSingularVectors: false });
  const s = svd.diagonal;
  const V = svd.rightSingularVectors;
  const sMax = Math.max(...s);
  const inverse = Array.from({ length: p }, (_, a) =>
    Array.from({ length: p }, (_, b) => {
      let sum = 0;
      for (let k = 0; k < p; k++) if (s[k] > sMax * 1e-15) sum += (V.get(a, k) * V.get(b, k)) / (s[k] * s[k]);
      return sum;
    }),
  );
  return { inverse, inverseCondition: sMax > 0 ? Math.min(...s) / sMax : 0 };
}

/** Minimise sum (w_i (b_i - A_i . p))^2. Rows of design are A_i. */
export function linearLeastSquares(design: number[][], b: number[], weights?: number[]): LinearFit {
  const n = design.length;
  const p = design[0].length;
  if (n <= p) throw new RangeError('linear least squares needs more rows than unknowns');
  // Plain loops: typed-array construction from a mapping function is slow in V8.
  const cols: Float64Array[] = [];
  for (let j = 0; j < p; j++) cols.push(new Float64Array(n));
  const rhs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i] : 1;
    const row = design[i];
    for (let j = 0; j < p; j++) cols[j][i] = row[j] * w;
    rhs[i] = b[i] * w;
  }
  const R = householderQr(cols, rhs);
  const params = new Array<number>(p).fill(0);
  for (let i = p - 1; i >= 0; i--) {
    let s = rhs[i];
    for (let j = i + 1; j < p; j++) s -= R[i][j] * params[j];
    params[i] = R[i][i] === 0 ? 0 : s / R[i][i];
  }
  const residuals = new Array<number>(n);
  let rss = 0;
  for (let i = 0; i < n; i++) {
    const row = design[i];
    let pred = 0;
    for (let j = 0; j < p; j++) pred += row[j] * params[j];
    residuals[i] = b[i] - pred;
    const r = residuals[i] * (weights ? weights[i] : 1);
    rss += r * r;
  }
  const dof = n - p;
  const { inverse } = inverseNormalFromR(R);
  const covariance = inverse.map((row) => row.map((v) => (v * rss) / dof));
  return { params, covariance, residuals, rss, dof };
}
