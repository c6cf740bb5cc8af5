// AIC and BIC for Gaussian least squares with unknown variance:
//   AIC = N ln(RSS/N) + 2p,  BIC = N ln(RSS/N) + p ln N,
// N = number of residuals. Only differences between models fitted to the same
// data mean anything.

export function aicGaussian(rss: number, nResiduals: number, nParams: number): number {
  return nResiduals * Math.log(Math.max(rss, Number.MIN_VALUE) / nResiduals) + 2 * nParams;
}

export function bicGaussian(rss: number, nResiduals: number, nParams: number): number {
  return nResiduals * Math.log(Math.max(rss, Number.MIN_VALUE) / nResiduals) + nParams * Math.log(nResiduals);
}
