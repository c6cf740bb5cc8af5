// Pooling approved fits into one preset value: the inverse-variance weighted
// mean (fixed-effect), its standard error, and Cochran's Q with I² to say when
// the shots disagree more than their own intervals allow. When they do, the
// pooled standard error is widened by the Birge ratio √(Q/(k−1)) (common
// practice in metrology and physical-constant averaging), so the preset never
// claims more certainty than the scatter of the shots supports.
import { sum } from 'simple-statistics';
import { chiSquareUpperTail } from './chi-square';

export interface PoolInput {
  /** Who this value came from (a fit id); carried through for provenance. */
  id: string;
  value: number;
  stdErr: number;
}

export interface Heterogeneity {
  /** Cochran's Q = Σ wᵢ (xᵢ − x̄)². */
  cochranQ: number;
  degreesOfFreedom: number;
  /** I² = max(0, (Q − df) / Q), Higgins & Thompson (2002). */
  iSquared: number;
  /** P(χ²_df > Q). Null with a single input. */
  pValue: number | null;
  /** √(Q/df), the Birge ratio. Null with a single input. */
  birgeRatio: number | null;
  disagree: boolean;
  verdict: string;
}

export interface PooledValue {
  value: number;
  /** Standard error of the weighted mean, 1/√Σwᵢ, before any widening. */
  stdErrFixed: number;
  /** The standard error the preset carries: stdErrFixed, widened by the Birge ratio when the inputs disagree. */
  stdErr: number;
  count: number;
  weights: number[];
  heterogeneity: Heterogeneity;
}

/** Thresholds for "disagree": I² above 50 % or p below 0.05 (common practice, Higgins et al. 2003 call 50 % "moderate"). */
export const I_SQUARED_LIMIT = 0.5;
export const P_VALUE_LIMIT = 0.05;

export class PoolInputError extends Error {}

export function poolInverseVariance(inputs: readonly PoolInput[]): PooledValue {
  if (inputs.length === 0) throw new PoolInputError('nothing to pool');
  for (const x of inputs) {
    if (!Number.isFinite(x.value)) throw new PoolInputError(`the value of ${x.id} is not a number`);
    if (!(x.stdErr > 0) || !Number.isFinite(x.stdErr)) throw new PoolInputError(`the uncertainty of ${x.id} is not a positive number`);
  }
  const weights = inputs.map((x) => 1 / (x.stdErr * x.stdErr));
  const totalWeight = sum(weights);
  const value = sum(inputs.map((x, i) => weights[i] * x.value)) / totalWeight;
  const stdErrFixed = 1 / Math.sqrt(totalWeight);
  const heterogeneity = heterogeneityOf(inputs.map((x) => x.value), weights, value);
  const widen = heterogeneity.disagree && heterogeneity.birgeRatio !== null && heterogeneity.birgeRatio > 1 ? heterogeneity.birgeRatio : 1;
  return { value, stdErrFixed, stdErr: stdErrFixed * widen, count: inputs.length, weights, heterogeneity };
}

function heterogeneityOf(values: number[], weights: number[], mean: number): Heterogeneity {
  const df = values.length - 1;
  const cochranQ = sum(values.map((x, i) => weights[i] * (x - mean) ** 2));
  if (df === 0) {
    return { cochranQ: 0, degreesOfFreedom: 0, iSquared: 0, pValue: null, birgeRatio: null, disagree: false, verdict: 'One fit only: no check of agreement between shots is possible.' };
  }
  const iSquared = cochranQ > 0 ? Math.max(0, (cochranQ - df) / cochranQ) : 0;
  const pValue = chiSquareUpperTail(cochranQ, df);
  const birgeRatio = Math.sqrt(cochranQ / df);
  const disagree = iSquared > I_SQUARED_LIMIT || pValue < P_VALUE_LIMIT;
  const pct = Math.round(iSquared * 100);
  const verdict = disagree
    ? `The shots disagree more than their intervals allow (I² = ${pct} %, p = ${pValue.toPrecision(2)}); the pooled uncertainty is widened by √(Q/(k−1)) = ${birgeRatio.toFixed(2)}. Look for a cause (a different projectile batch, pressure reading or flow regime) before trusting the preset.`
    : `The shots agree within their intervals (I² = ${pct} %, p = ${pValue.toPrecision(2)}).`;
  return { cochranQ, degreesOfFreedom: df, iSquared, pValue, birgeRatio, disagree, verdict };
}
