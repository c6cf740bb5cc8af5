// Plumb-line lens calibration (Brown, "Close-range camera calibration",
// Photogrammetric Engineering 37(8), 1971): edges that are straight in the
// world must come out straight once the distortion is undone. The analyst
// clicks points along such edges; we fit the radial coefficients (k1, or k1
// and k2 — see lens-distortion.ts for the model) together with one straight
// line per edge by least squares (ml-levenberg-marquardt through
// shared/physics/least-squares.ts).
//
// Parameters: [k1, (k2), θ_1, ρ_1, …, θ_L, ρ_L]; line j is
// cos θ_j · x + sin θ_j · y = ρ_j in normalised ideal coordinates.
// Residual of a click: its ideal point's distance from its line, converted
// back to frame pixels through the local stretch of the undistortion (so
// residuals and the click noise they estimate are in the same pixels the
// person clicked in, whatever the distortion).
//
// A line through the image centre stays straight under any radial distortion,
// so it carries no information about k; lines near the frame edge carry the
// most. With too few points for k2 the fit falls back to k1 alone and says so.
import { leastSquares } from '../physics/least-squares';
import { lensModelForFrame, undistortRadius, type LensModel, type RadialCoefficients } from './lens-distortion';
import { GeometryError, type PixelPoint } from './points';

export interface PlumbLineOptions {
  /** 1: k1 only; 2: k1 and k2; 'auto' (default): k2 when there are points enough to spare. */
  terms?: 1 | 2 | 'auto';
  /**
   * Standard uncertainty of one click, px. When given, the coefficient
   * uncertainties use the larger of this and the residual scatter, so a fit
   * that happens to pass very close to a few clicks does not claim more than
   * the clicking supports.
   */
  clickSigmaPx?: number;
}

export interface PlumbLineFit {
  model: 'brown-conrady-radial';
  coefficients: RadialCoefficients;
  /** Standard uncertainties of k1 and k2 (k2: 0 when not fitted). */
  standardUncertainty: RadialCoefficients;
  /** Covariance of [k1, k2] (zeros for k2 when not fitted). */
  covariance: [[number, number], [number, number]];
  terms: 1 | 2;
  /** Root mean square distance of the clicks from their fitted straight lines, frame px. */
  residualRmsPx: number;
  /** Per line, same measure. */
  lineResidualRmsPx: number[];
  /** Residual standard deviation √(RSS / dof), px. */
  residualSigmaPx: number;
  degreesOfFreedom: number;
  lineCount: number;
  pointCount: number;
  /** Plain-words remarks (fallback to one term, lines through the centre). */
  notes: string[];
}

export interface FrameSize {
  widthPx: number;
  heightPx: number;
}

/** Total-least-squares line through points: unit normal (cos θ, sin θ), offset ρ, and the spread along it. */
function principalLine(xs: number[], ys: number[]): { theta: number; rho: number; spread: number; rms: number } {
  const n = xs.length;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const my = ys.reduce((a, b) => a + b, 0) / n;
  let sxx = 0, syy = 0, sxy = 0;
  for (let i = 0; i < n; i++) {
    const dx = xs[i] - mx, dy = ys[i] - my;
    sxx += dx * dx; syy += dy * dy; sxy += dx * dy;
  }
  // Direction of largest spread; the normal is perpendicular to it.
  const dirAngle = 0.5 * Math.atan2(2 * sxy, sxx - syy);
  const theta = dirAngle + Math.PI / 2;
  const nx = Math.cos(theta), ny = Math.sin(theta);
  let along = 0, across = 0;
  let minT = Infinity, maxT = -Infinity;
  for (let i = 0; i < n; i++) {
    const t = (xs[i] - mx) * -ny + (ys[i] - my) * nx;
    minT = Math.min(minT, t); maxT = Math.max(maxT, t);
    const d = (xs[i] - mx) * nx + (ys[i] - my) * ny;
    across += d * d;
    along += t * t;
  }
  void along;
  return { theta, rho: mx * nx + my * ny, spread: maxT - minT, rms: Math.sqrt(across / n) };
}

/** Normalised ideal coordinates of a clicked point and the 2×2 Jacobian of the undistortion there. */
function undistortWithJacobian(c: RadialCoefficients, x: number, y: number) {
  const rd = Math.hypot(x, y);
  if (rd === 0) return { xu: 0, yu: 0, j: [1 / (1 + 0), 0, 0, 1] as number[] };
  const ru = undistortRadius(c, rd);
  const g = ru / rd;
  // d r_u / d r_d = 1 / (d r_d / d r_u).
  const r2 = ru * ru;
  const dru = 1 / (1 + r2 * (3 * c.k1 + 5 * c.k2 * r2));
  const gPrime = (dru - g) / rd;
  // J = g I + g'(r_d) x xᵀ / r_d
  const a = gPrime / rd;
  return { xu: x * g, yu: y * g, j: [g + a * x * x, a * x * y, a * x * y, g + a * y * y] };
}

function fail(message: string, field = 'lens.straightLines'): never {
  throw new GeometryError(message, field);
}

/** Checks the clicked lines and refuses, with a plain message, any set that cannot determine the distortion. */
export function checkStraightLines(lines: readonly (readonly PixelPoint[])[], model: LensModel): string[] {
  const notes: string[] = [];
  if (!Array.isArray(lines) || lines.length < 2) {
    fail('Click at least 2 straight edges (fence rails, posts, building edges), ideally at different distances from the centre.');
  }
  const R = model.normRadiusPx;
  let informative = 0;
  lines.forEach((line, j) => {
    const field = `lens.straightLines.${j}`;
    if (!Array.isArray(line) || line.length < 3) fail(`Straight edge ${j + 1} has ${line?.length ?? 0} point(s); click at least 3 along it.`, field);
    if (line.some((p) => !Number.isFinite(p.u) || !Number.isFinite(p.v))) fail(`Straight edge ${j + 1} has a point that is not a number.`, field);
    const xs = line.map((p) => (p.u - model.centre.u) / R);
    const ys = line.map((p) => (p.v - model.centre.v) / R);
    const pl = principalLine(xs, ys);
    if (pl.spread < 0.05) {
      fail(`The points of straight edge ${j + 1} lie too close together; spread them along the whole visible edge.`, field);
    }
    // Closest approach of the edge to the centre, as a share of the half-diagonal.
    if (Math.abs(pl.rho) < 0.03) {
      notes.push(`Straight edge ${j + 1} runs through the image centre, where a radial distortion bends nothing; it does not help the fit.`);
    } else {
      informative++;
    }
  });
  if (informative === 0) {
    fail('Every clicked edge runs through the image centre, where a radial distortion bends nothing; click edges nearer the frame sides or corners.');
  }
  // All the clicks on one straight line: the "edges" are one edge, and a single chord cannot tell a bend from a tilt.
  const allX = lines.flatMap((l: readonly PixelPoint[]) => l.map((p: PixelPoint) => (p.u - model.centre.u) / R));
  const allY = lines.flatMap((l: readonly PixelPoint[]) => l.map((p: PixelPoint) => (p.v - model.centre.v) / R));
  const all = principalLine(allX, allY);
  if (all.rms < 1e-3 || all.rms * R < 0.5) {
    fail('All the clicked points lie on one straight line; click different edges, ideally at different distances from the centre.');
  }
  return notes;
}

export function fitPlumbLines(
  lines: readonly (readonly PixelPoint[])[], frame: FrameSize, options: PlumbLineOptions = {},
): PlumbLineFit {
  const base = lensModelForFrame(frame.widthPx, frame.heightPx, { k1: 0, k2: 0 });
  const notes = checkStraightLines(lines, base);
  const R = base.normRadiusPx;
  const L = lines.length;
  const xs: number[] = [];
  const ys: number[] = [];
  const lineOf: number[] = [];
  lines.forEach((line, j) => line.forEach((p) => {
    xs.push((p.u - base.centre.u) / R);
    ys.push((p.v - base.centre.v) / R);
    lineOf.push(j);
  }));
  const n = xs.length;

  const run = (terms: 1 | 2) => {
    const np = terms + 2 * L;
    const start: number[] = terms === 2 ? [0, 0] : [0];
    const typical: number[] = terms === 2 ? [0.05, 0.05] : [0.05];
    lines.forEach((_, j) => {
      const idx = lineOf.flatMap((l, i) => (l === j ? [i] : []));
      const pl = principalLine(idx.map((i) => xs[i]), idx.map((i) => ys[i]));
      start.push(pl.theta, pl.rho);
      typical.push(0.1, 0.1);
    });
    const coeffs = (p: ArrayLike<number>): RadialCoefficients => ({ k1: p[0], k2: terms === 2 ? p[1] : 0 });
    // Signed distance of each ideal point from its line, as frame pixels (see header).
    const model = (p: Float64Array, out: Float64Array) => {
      const c = coeffs(p);
      for (let i = 0; i < n; i++) {
        const th = p[terms + 2 * lineOf[i]];
        const rho = p[terms + 2 * lineOf[i] + 1];
        const nx = Math.cos(th), ny = Math.sin(th);
        const { xu, yu, j } = undistortWithJacobian(c, xs[i], ys[i]);
        // |Jᵀ n|: how fast the distance changes per unit move of the click, at best.
        const stretch = Math.hypot(j[0] * nx + j[2] * ny, j[1] * nx + j[3] * ny);
        out[i] = ((nx * xu + ny * yu - rho) / stretch) * R;
      }
    };
    if (n <= np) return null;
    const fit = leastSquares(
      { observations: new Float64Array(n), model, start, typicalMagnitude: typical },
      { maxIterations: 600, burstIterations: 6 },
    );
    return { fit, terms, np };
  };

  const wanted = options.terms ?? 'auto';
  let terms: 1 | 2 = wanted === 'auto' ? (n - 2 * L - 2 >= 3 ? 2 : 1) : wanted;
  let result = run(terms);
  if (!result) fail(`${n} points on ${L} edges are too few to fit ${terms} lens coefficient(s); click more points along each edge.`);
  // Two terms that the lines cannot separate (all edges at one distance from the centre): fall back to k1.
  if (terms === 2 && wanted === 'auto' && !(result.fit.inverseCondition > 1e-9 && Math.abs(result.fit.correlation[0][1]) < 0.9995)) {
    notes.push('These edges cannot separate k1 from k2 (they lie at similar distances from the centre), so only k1 was fitted.');
    terms = 1;
    result = run(1) as NonNullable<typeof result>;
  } else if (terms === 1 && wanted === 'auto') {
    notes.push('Only k1 was fitted: k2 needs more points (at least 5 more than twice the number of edges).');
  }
  const { fit } = result;
  const se0 = fit.stdErrors[0];
  if (!(fit.inverseCondition > 1e-12) || !Number.isFinite(se0)) {
    fail('These edges do not determine the lens distortion; click edges nearer the frame sides or corners, at different distances from the centre.');
  }
  const s2 = fit.residualVariance;
  const floor2 = options.clickSigmaPx !== undefined ? options.clickSigmaPx ** 2 : 0;
  const inflate = s2 > 0 ? Math.max(1, floor2 / s2) : 1;
  const cov = fit.covariance;
  const c00 = cov[0][0] * inflate;
  const c01 = terms === 2 ? cov[0][1] * inflate : 0;
  const c11 = terms === 2 ? cov[1][1] * inflate : 0;
  const residuals = fit.residuals.map((r) => -r); // observations are zero: residual = −model
  const lineResidualRmsPx = lines.map((_, j) => {
    const rs = residuals.filter((_, i) => lineOf[i] === j);
    return Math.sqrt(rs.reduce((a, r) => a + r * r, 0) / rs.length);
  });
  return {
    model: 'brown-conrady-radial',
    coefficients: { k1: fit.params[0], k2: terms === 2 ? fit.params[1] : 0 },
    standardUncertainty: { k1: Math.sqrt(c00), k2: Math.sqrt(c11) },
    covariance: [[c00, c01], [c01, c11]],
    terms,
    residualRmsPx: Math.sqrt(fit.rss / n),
    lineResidualRmsPx,
    residualSigmaPx: Math.sqrt(s2),
    degreesOfFreedom: fit.dof,
    lineCount: L,
    pointCount: n,
    notes,
  };
}
