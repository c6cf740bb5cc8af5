// The time of each frame, from the rate the analyst says the camera captured
// at, and what the file's timestamps reveal (variable rate, dropped or repeated
// frames). Pure: no I/O, so the rules are unit-tested directly.
import type { ClipWarning, FrameFlag } from '../../shared/schemas/clips';

export interface FrameTime {
  frameNumber: number;
  ptsS: number;
  /** Seconds since frame 0 in capture (real) time. */
  tS: number;
  flag: FrameFlag | null;
}

export interface TimeBase {
  variableFrameRate: boolean;
  /** Median playback interval between frames (s). */
  medianIntervalS: number;
  frames: FrameTime[];
  warnings: ClipWarning[];
}

export interface TimeBaseInput {
  /** Presentation timestamps in display order (s). */
  ptsS: number[];
  /** avg_frame_rate of the file. */
  containerFps: number;
  /** r_frame_rate of the file (the nominal tick). */
  baseFps: number;
  captureFps: number;
}

// Thresholds (our rules, common practice rather than a standard):
/** An interval longer than this many median intervals means frames are missing. */
const DROP_FACTOR = 1.5;
/** An interval shorter than this fraction of the median repeats the previous frame's time. */
const DUPLICATE_FACTOR = 0.01;
/** Intervals within ±10 % of the median, or within the timestamp rounding of millisecond containers (Matroska), count as steady. */
const STEADY_FRACTION = 0.1;
const MS_ROUNDING_S = 0.0011;
/** A file is variable-rate when more than this share of its ordinary intervals are not steady. */
const VFR_SHARE = 0.05;
/** A variable-rate file whose average playback rate is within this fraction of the stated capture rate plays in real time. */
const VFR_REAL_TIME_TOLERANCE = 0.1;

function median(values: number[]): number {
  if (values.length === 0) return NaN;
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

export function formatFps(fps: number): string {
  if (!Number.isFinite(fps)) return '?';
  return Number.isInteger(Math.round(fps * 1000) / 1000) ? String(Math.round(fps)) : String(Math.round(fps * 1000) / 1000);
}

/** Is the stated capture rate meaningfully different from the playback rate (more than 1 %)? */
export function ratesDiffer(containerFps: number, captureFps: number): boolean {
  return Math.abs(containerFps - captureFps) / captureFps > 0.01;
}

export function rateWarning(containerFps: number, captureFps: number): ClipWarning | null {
  if (!ratesDiffer(containerFps, captureFps)) return null;
  return {
    code: 'rate-differs',
    message: `Plays at ${formatFps(containerFps)} fps but was captured at ${formatFps(captureFps)} fps: times use ${formatFps(captureFps)} fps.`,
  };
}

export function analyseTimeBase(input: TimeBaseInput): TimeBase {
  const { ptsS, captureFps } = input;
  const n = ptsS.length;
  const intervals: number[] = [];
  for (let i = 1; i < n; i++) intervals.push(ptsS[i] - ptsS[i - 1]);
  const positive = intervals.filter((d) => d > 0);
  const fallbackInterval = 1 / (input.baseFps || input.containerFps || captureFps);
  const m = positive.length > 0 ? median(positive) : fallbackInterval;

  const flags: (FrameFlag | null)[] = new Array(n).fill(null);
  let steady = 0;
  let unsteady = 0;
  intervals.forEach((d, k) => {
    const i = k + 1;
    if (d <= m * DUPLICATE_FACTOR) flags[i] = 'duplicate';
    else if (d > m * DROP_FACTOR) flags[i] = 'dropped-before';
    else if (Math.abs(d - m) <= Math.max(STEADY_FRACTION * m, MS_ROUNDING_S)) steady++;
    else unsteady++;
  });
  const variableFrameRate = unsteady > VFR_SHARE * (steady + unsteady) && unsteady >= 2;

  // Constant rate: count frame slots on the nominal tick (so a dropped frame
  // leaves its slot empty) and time them at the capture rate. Variable rate:
  // timestamps are all there is; scale playback time by playback/capture.
  // The nominal tick: the stated base rate when the intervals agree with it
  // (within the steady band), else the mean of the ordinary intervals.
  const ordinary = positive.filter((d) => d > m * DUPLICATE_FACTOR && d <= m * DROP_FACTOR);
  const meanInterval = ordinary.length > 0 ? ordinary.reduce((a, b) => a + b, 0) / ordinary.length : m;
  const tickFps =
    input.baseFps > 0 && Math.abs(1 / input.baseFps - meanInterval) <= Math.max(STEADY_FRACTION * meanInterval, MS_ROUNDING_S) ? input.baseFps : 1 / meanInterval;
  const t0 = n > 0 ? ptsS[0] : 0;
  const playbackFps = input.containerFps > 0 ? input.containerFps : tickFps;
  // A variable-rate file's average rate is not a clock: jitter and gaps pull it
  // off the camera's nominal rate. A stated rate within 10 % of it means the
  // file plays in real time, so its timestamps are real time (our rule).
  const vfrScale = Math.abs(playbackFps / captureFps - 1) <= VFR_REAL_TIME_TOLERANCE ? 1 : playbackFps / captureFps;
  const frames: FrameTime[] = ptsS.map((pts, frameNumber) => ({
    frameNumber,
    ptsS: pts,
    tS: variableFrameRate ? (pts - t0) * vfrScale : Math.round((pts - t0) * tickFps) / captureFps,
    flag: flags[frameNumber],
  }));

  const warnings: ClipWarning[] = [];
  const rate = variableFrameRate ? (vfrScale === 1 ? null : rateWarning(playbackFps, captureFps)) : rateWarning(tickFps, captureFps);
  if (rate) warnings.push(rate);
  if (variableFrameRate) {
    const lo = 1 / Math.max(...ordinary);
    const hi = 1 / Math.min(...ordinary);
    warnings.push({
      code: 'variable-frame-rate',
      message:
        vfrScale === 1
          ? `Frame intervals vary (variable frame rate, ${formatFps(lo)}–${formatFps(hi)} fps): each frame's time comes from its own timestamp.`
          : `Frame intervals vary (variable frame rate, ${formatFps(lo)}–${formatFps(hi)} fps in playback): each frame's time comes from its own timestamp, scaled by ${formatFps(playbackFps)}/${formatFps(captureFps)}.`,
    });
  }
  const dropped = flags.map((f, i) => (f === 'dropped-before' ? i : -1)).filter((i) => i >= 0);
  if (dropped.length > 0) {
    warnings.push({
      code: 'dropped-frames',
      message: `${dropped.length} gap${dropped.length > 1 ? 's' : ''} in the timestamps suggest dropped frames (first before frame ${dropped[0]}); times skip the missing frames.`,
    });
  }
  const repeated = flags.map((f, i) => (f === 'duplicate' ? i : -1)).filter((i) => i >= 0);
  if (repeated.length > 0) {
    warnings.push({
      code: 'duplicate-frames',
      message: `${repeated.length} frame${repeated.length > 1 ? 's repeat' : ' repeats'} the previous frame's timestamp (first at frame ${repeated[0]}); do not mark both.`,
    });
  }
  return { variableFrameRate, medianIntervalS: m, frames, warnings };
}
