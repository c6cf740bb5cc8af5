// Where the projectile should be next: a least-squares polynomial in frame
// number per pixel axis, fitted to the nearest marks so far. Over a dozen
// frames a quadratic follows a drag-slowed ballistic path to well under a
// pixel (drag and gravity change the acceleration only slowly), and it needs
// no scale or frame rate. The gate (how far a candidate may sit from the
// prediction) comes from the fit's own scatter and shrinks as the track grows.

export interface TrackPoint {
  frameNumber: number;
  u: number;
  v: number;
}

export interface Prediction {
  u: number;
  v: number;
  /** Velocity at the predicted frame, px per frame. */
  du: number;
  dv: number;
  speedPx: number;
  gatePx: number;
  /** Frames between the prediction and the nearest point used. */
  ahead: number;
  degree: number;
}

function solve(a: number[][], b: number[]): number[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    if (Math.abs(m[p][c]) < 1e-12) return null;
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = m[r][c] / m[c][c];
      for (let k = c; k <= n; k++) m[r][k] -= f * m[c][k];
    }
  }
  return m.map((row, i) => row[n] / row[i]);
}

function polyFit(ts: number[], ys: number[], degree: number): number[] {
  const n = degree + 1;
  const a = Array.from({ length: n }, () => new Array(n).fill(0));
  const b = new Array(n).fill(0);
  for (let i = 0; i < ts.length; i++) {
    const pw = [1];
    for (let k = 1; k < 2 * n; k++) pw.push(pw[k - 1] * ts[i]);
    for (let r = 0; r < n; r++) {
      b[r] += pw[r] * ys[i];
      for (let c = 0; c < n; c++) a[r][c] += pw[r + c];
    }
  }
  return solve(a, b) ?? (degree > 0 ? [...polyFit(ts, ys, degree - 1), 0] : [ys.reduce((s, y) => s + y, 0) / ys.length]);
}

const evalPoly = (c: number[], t: number) => c.reduce((s, ck, k) => s + ck * t ** k, 0);
const evalSlope = (c: number[], t: number) => c.reduce((s, ck, k) => (k ? s + k * ck * t ** (k - 1) : s), 0);

/** Prediction at `frameNumber` from the `maxPoints` points nearest to it. */
export function predictAt(points: TrackPoint[], frameNumber: number, maxPoints = 12): Prediction {
  const near = [...points].sort((a, b) => Math.abs(a.frameNumber - frameNumber) - Math.abs(b.frameNumber - frameNumber)).slice(0, maxPoints);
  const n = near.length;
  const degree = n >= 6 ? 2 : n >= 2 ? 1 : 0;
  const ts = near.map((p) => p.frameNumber - frameNumber);
  const cu = polyFit(ts, near.map((p) => p.u), degree);
  const cv = polyFit(ts, near.map((p) => p.v), degree);
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (near[i].u - evalPoly(cu, ts[i])) ** 2 + (near[i].v - evalPoly(cv, ts[i])) ** 2;
  const dof = Math.max(1, 2 * n - 2 * (degree + 1));
  const rms = Math.sqrt(rss / dof);
  const du = evalSlope(cu, 0);
  const dv = evalSlope(cv, 0);
  const speedPx = Math.hypot(du, dv);
  const ahead = Math.min(...ts.map((t) => Math.abs(t)));
  // Young tracks: a linear guess, off by up to the change in velocity; mature ones: a few times the fit's scatter.
  const base = degree === 2 ? 1.2 + 4 * Math.max(rms, 0.1) : 3 + 0.3 * speedPx;
  const gatePx = Math.min(base * (1 + 0.35 * (ahead - 1)) + 0.08 * (ahead - 1) ** 2 * (1 + 0.1 * speedPx), 12 + speedPx);
  return { u: evalPoly(cu, 0), v: evalPoly(cv, 0), du, dv, speedPx, gatePx, ahead, degree };
}

/** Root-mean-square distance of the points from their own quadratic fit (a straightness check for candidate chains). */
export function quadraticScatterPx(points: TrackPoint[]): number {
  const t0 = points[0].frameNumber;
  const ts = points.map((p) => p.frameNumber - t0);
  const degree = points.length >= 4 ? 2 : 1;
  const cu = polyFit(ts, points.map((p) => p.u), degree);
  const cv = polyFit(ts, points.map((p) => p.v), degree);
  let rss = 0;
  for (let i = 0; i < points.length; i++) rss += (points[i].u - evalPoly(cu, ts[i])) ** 2 + (points[i].v - evalPoly(cv, ts[i])) ** 2;
  return Math.sqrt(rss / Math.max(1, points.length - degree - 1));
}
