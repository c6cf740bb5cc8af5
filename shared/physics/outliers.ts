// Robust outlier flags: a mark is flagged when its x or y residual is more
// than 3.5 robust standard deviations from the median, the robust sigma being
// 1.4826 x MAD (consistent with sigma for Gaussian scatter). Common practice.
import { median } from 'simple-statistics';

export const OUTLIER_THRESHOLD = 3.5;
const MAD_TO_SIGMA = 1.4826;

export function flagOutliers(rx: number[], ry: number[]): boolean[] {
  const all = [...rx, ...ry];
  const med = median(all);
  const mad = median(all.map((r) => Math.abs(r - med)));
  // Floor at 1 nm: exact synthetic data would otherwise flag rounding noise.
  const limit = Math.max(OUTLIER_THRESHOLD * MAD_TO_SIGMA * mad, 1e-9);
  return rx.map((x, i) => Math.abs(x - med) > limit || Math.abs(ry[i] - med) > limit);
}
