// A mark's confidence (0–1) and, when it is low, the main reason in plain
// words. Each factor is 1 when all is well and falls toward 0 as its problem
// grows; the confidence is their product, the reason the weakest factor's.
// The shapes are heuristics tuned on generated clips (common practice for
// tracking quality scores), not probabilities.

export interface ConfidenceInputs {
  /** Peak contrast over the noise of the smoothed difference. */
  snr: number;
  /** Distance from the prediction over the gate radius (0 … 1). */
  gateRatio: number;
  /** Another blob close to the mark. */
  neighbour: boolean;
  /** Long axis over short axis of the blob's spread. */
  elongation: number;
  /** Seen coverage over the track's usual coverage. */
  coverageRatio: number;
}

export const LOW_CONFIDENCE = 0.6;

export function markConfidence(x: ConfidenceInputs): { confidence: number; reason: string | null } {
  const factors: [number, string][] = [
    [(x.snr * x.snr) / (x.snr * x.snr + 40), 'weak contrast'],
    [1 - 0.6 * Math.min(1, x.gateRatio) ** 2, 'outside the gate'],
    [x.neighbour ? 0.55 : 1, 'another object near'],
    [x.elongation > 2.5 ? Math.max(0.4, 1 - 0.15 * (x.elongation - 2.5)) : 1, 'blurred'],
    [x.coverageRatio < 0.8 ? 0.3 + 0.7 * Math.max(0, (x.coverageRatio - 0.65) / 0.15) : 1, 'partly hidden'],
  ];
  const confidence = factors.reduce((p, [f]) => p * f, 1);
  const weakest = factors.reduce((a, b) => (b[0] < a[0] ? b : a));
  return { confidence: Math.max(0, Math.min(1, confidence)), reason: confidence < LOW_CONFIDENCE ? weakest[1] : null };
}
