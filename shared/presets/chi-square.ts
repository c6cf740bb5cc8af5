// Upper tail of the chi-square distribution, for the heterogeneity p-value.
// P(X > x) for k degrees of freedom is the regularised upper incomplete gamma
// function Q(k/2, x/2). Series below a+1, Lentz continued fraction above, as in
// Press et al., Numerical Recipes (3rd ed.), §6.2.

/** ln Γ(x) by the Lanczos approximation (g = 7, n = 9), good to ~1e-15 for x > 0. */
export function logGamma(x: number): number {
  const c = [
    0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
    12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
  ];
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  const z = x - 1;
  let a = c[0];
  const t = z + 7.5;
  for (let i = 1; i < 9; i++) a += c[i] / (z + i);
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}

const EPS = 1e-15;
const MAX_ITER = 500;

/** Regularised lower incomplete gamma P(a, x) by its series (converges fast for x < a + 1). */
function lowerSeries(a: number, x: number): number {
  let sum = 1 / a, term = sum, ap = a;
  for (let n = 0; n < MAX_ITER; n++) {
    ap += 1;
    term *= x / ap;
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * EPS) break;
  }
  return sum * Math.exp(-x + a * Math.log(x) - logGamma(a));
}

/** Regularised upper incomplete gamma Q(a, x) by continued fraction (x >= a + 1). */
function upperFraction(a: number, x: number): number {
  const tiny = 1e-300;
  let b = x + 1 - a, c = 1 / tiny, d = 1 / b, h = d;
  for (let i = 1; i < MAX_ITER; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b; if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c; if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < EPS) break;
  }
  return Math.exp(-x + a * Math.log(x) - logGamma(a)) * h;
}

export function regularisedUpperGamma(a: number, x: number): number {
  if (!(a > 0)) throw new RangeError('a must be positive');
  if (x <= 0) return 1;
  return x < a + 1 ? 1 - lowerSeries(a, x) : upperFraction(a, x);
}

/** P(χ²_k > x): the probability of a statistic at least this large when the model holds. */
export function chiSquareUpperTail(x: number, degreesOfFreedom: number): number {
  return regularisedUpperGamma(degreesOfFreedom / 2, x / 2);
}
