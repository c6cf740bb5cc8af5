// Differences between a frame and the background model, and the compact blobs
// in them: full-frame (downscaled) for detection, or in a small window around
// a predicted position once a track exists. All image work here is OpenCV's;
// every Mat is owned by this object and freed by dispose().
import type { Mat } from '@techstark/opencv-js';
import type { BackgroundModel } from './background-model';
import { medianOf } from './brightness';
import type { OpenCv } from './opencv';
import type { GrayFrame } from './types';

export interface Blob {
  u: number;
  v: number;
  /** Pixels above threshold (full-resolution pixels). */
  area: number;
  /** Bounding box, full-frame pixels. */
  bboxLeft: number;
  bboxTop: number;
  bboxWidth: number;
  bboxHeight: number;
  /** +1: darker than the background; -1: brighter. */
  polarity: 1 | -1;
  /** Peak contrast of the smoothed difference, gray levels. */
  peak: number;
  /** Label in the last window measured (window blobs only). */
  label: number;
}

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Centroid {
  u: number;
  v: number;
  /** Sum of the coverage inside the final ellipse (no threshold): about the projectile's area in pixels when fully seen. */
  coverage: number;
  /** Square roots of the eigenvalues of the weighted second moments (px): the blob's spread along and across its long axis. */
  majorPx: number;
  minorPx: number;
  touchesFrameEdge: boolean;
  /** Mean temporal spread of the background under the projectile (gray levels). */
  localSpread: number;
}

/** Noise of the difference image, in gray levels (robust σ). */
export interface DiffNoise {
  raw: number;
  smoothed: number;
  detection: number;
}

const MAD_TO_SIGMA = 1.4826;

export class SceneDiff {
  readonly width: number;
  readonly height: number;
  /** Detection runs on frames downscaled by this factor (area averaging). */
  readonly detectScale: number;
  noise: DiffNoise = { raw: 2, smoothed: 1, detection: 1 };
  gain = 1;

  private readonly frame: Mat;
  private readonly bg: Mat;
  private readonly mats: Mat[] = [];
  private readonly f32: Mat;
  private readonly s32: Mat;
  private readonly small: Mat;
  private readonly smallBlur: Mat;
  private readonly smallAbs: Mat;
  private readonly zerosSmall: Mat;
  private readonly bin: Mat;
  private readonly labels: Mat;
  private readonly stats: Mat;
  private readonly centroids: Mat;
  private readonly kernel: Mat;
  /** Per-pixel thresholds: detection scale, and full resolution for windows (see buildThresholds). */
  private readonly thrSmall: Mat;
  private readonly thrFull: Mat;
  private readonly spread: Mat;
  // Window work.
  private win: { rect: Rect; d: Float32Array; db: Float32Array; labels: Int32Array; f: Float32Array; bg: Float32Array; spread: Float32Array; polarity: 1 | -1 } | null = null;

  constructor(
    private readonly cv: OpenCv,
    private readonly model: BackgroundModel,
  ) {
    this.width = model.width;
    this.height = model.height;
    this.detectScale = Math.max(1, Math.round(Math.max(model.width / 640, model.height / 360)));
    const keep = (m: Mat) => (this.mats.push(m), m);
    this.frame = keep(new cv.Mat(this.height, this.width, cv.CV_8UC1));
    this.bg = keep(new cv.Mat(this.height, this.width, cv.CV_32FC1));
    this.f32 = keep(new cv.Mat());
    this.s32 = keep(new cv.Mat());
    this.small = keep(new cv.Mat());
    this.smallBlur = keep(new cv.Mat());
    this.smallAbs = keep(new cv.Mat());
    const sw = Math.ceil(this.width / this.detectScale);
    const sh = Math.ceil(this.height / this.detectScale);
    this.zerosSmall = keep(cv.Mat.zeros(sh, sw, cv.CV_32FC1));
    this.bin = keep(new cv.Mat());
    this.labels = keep(new cv.Mat());
    this.stats = keep(new cv.Mat());
    this.centroids = keep(new cv.Mat());
    this.kernel = keep(cv.getStructuringElement(cv.MORPH_ELLIPSE, new cv.Size(5, 5)));
    this.thrSmall = keep(new cv.Mat());
    this.thrFull = keep(new cv.Mat());
    this.spread = keep(new cv.Mat(this.height, this.width, cv.CV_32FC1));
    this.refreshBackground();
  }

  /** Copy the model into OpenCV memory again (after patchBackground) and rebuild the thresholds. */
  refreshBackground() {
    this.bg.data32F.set(this.model.data);
    this.spread.data32F.set(this.model.spread);
    // Busy patches are busy over an area (foliage, ringing beside a post): smooth the noisy per-pixel estimate.
    this.cv.GaussianBlur(this.spread, this.spread, new this.cv.Size(5, 5), 0, 0, this.cv.BORDER_REPLICATE);
    this.buildThresholds();
  }

  /**
   * Threshold maps: k × the larger of the frame's global noise and the
   * pixel's own temporal spread (both carried to the smoothed, downscaled
   * difference by the ratio measured on the whole frame).
   */
  private buildThresholds(detectK = 5, windowK = 4) {
    const cv = this.cv;
    const { raw, smoothed, detection } = this.noise;
    const full = new cv.Mat();
    const fullFloor = new cv.Mat(this.height, this.width, cv.CV_32FC1, new cv.Scalar(Math.max(2, windowK * smoothed)));
    try {
      this.spread.convertTo(full, cv.CV_32F, (windowK * smoothed) / raw);
      cv.max(full, fullFloor, this.thrFull);
      const small = new cv.Mat();
      const floor = new cv.Mat(this.zerosSmall.rows, this.zerosSmall.cols, cv.CV_32FC1, new cv.Scalar(Math.max(2.5, detectK * detection)));
      if (this.detectScale > 1) cv.resize(this.spread, small, new cv.Size(this.zerosSmall.cols, this.zerosSmall.rows), 0, 0, cv.INTER_AREA);
      else this.spread.copyTo(small);
      small.convertTo(small, cv.CV_32F, (detectK * detection) / raw);
      cv.max(small, floor, this.thrSmall);
      small.delete();
      floor.delete();
    } finally {
      full.delete();
      fullFloor.delete();
    }
  }

  dispose() {
    for (const m of this.mats.splice(0)) m.delete();
  }

  setFrame(frame: GrayFrame, gain: number) {
    this.frame.data.set(frame.data.subarray(0, this.width * this.height));
    this.gain = gain;
    this.win = null;
  }

  /** Signed difference (frame − background) over the whole frame, downscaled and smoothed, in this.smallBlur. */
  private fullDifference() {
    const cv = this.cv;
    this.frame.convertTo(this.f32, cv.CV_32F, this.gain);
    cv.subtract(this.f32, this.bg, this.s32);
    if (this.detectScale > 1) {
      cv.resize(this.s32, this.small, new cv.Size(this.zerosSmall.cols, this.zerosSmall.rows), 0, 0, cv.INTER_AREA);
      cv.GaussianBlur(this.small, this.smallBlur, new cv.Size(3, 3), 0);
    } else {
      cv.GaussianBlur(this.s32, this.smallBlur, new cv.Size(3, 3), 0);
    }
  }

  /** Measures the noise of the difference images on the current frame (robust, so moving things barely count). */
  estimateNoise(): DiffNoise {
    const cv = this.cv;
    this.fullDifference();
    const rawDiff = this.s32.data32F;
    const blurred = new cv.Mat();
    cv.GaussianBlur(this.s32, blurred, new cv.Size(3, 3), 0);
    const grid = this.model.grid;
    const a = new Float64Array(grid.length);
    const b = new Float64Array(grid.length);
    for (let k = 0; k < grid.length; k++) {
      a[k] = rawDiff[grid[k]];
      b[k] = blurred.data32F[grid[k]];
    }
    blurred.delete();
    const sd = this.smallBlur.data32F;
    const step = Math.max(1, Math.floor(sd.length / grid.length));
    const c = new Float64Array(Math.floor(sd.length / step));
    for (let k = 0; k < c.length; k++) c[k] = sd[k * step];
    const sigma = (x: Float64Array) => {
      const med = medianOf(x);
      return MAD_TO_SIGMA * medianOf(x.map((v) => Math.abs(v - med)));
    };
    this.noise = { raw: Math.max(0.5, sigma(a)), smoothed: Math.max(0.3, sigma(b)), detection: Math.max(0.3, sigma(c)) };
    this.buildThresholds();
    return this.noise;
  }

  /** Compact blobs that differ from the background over the whole frame (coarse positions, full-frame pixels). */
  detectAll(minArea: number, maxArea: number): Blob[] {
    const cv = this.cv;
    this.fullDifference();
    cv.absdiff(this.smallBlur, this.zerosSmall, this.smallAbs);
    cv.compare(this.smallAbs, this.thrSmall, this.bin, cv.CMP_GT);
    const n = cv.connectedComponentsWithStats(this.bin, this.labels, this.stats, this.centroids, 8, cv.CV_32S);
    const s = this.detectScale;
    const st = this.stats.data32S;
    const ce = this.centroids.data64F;
    const sd = this.smallBlur.data32F;
    const sw = this.zerosSmall.cols;
    const out: Blob[] = [];
    for (let i = 1; i < n; i++) {
      const area = st[i * 5 + 4] * s * s;
      if (area < minArea || area > maxArea) continue;
      const bw = st[i * 5 + 2];
      const bh = st[i * 5 + 3];
      // Compact: not a long thin sliver (edges of a slowly moving person, a swaying branch).
      if (Math.max(bw, bh) > 4 * Math.min(bw, bh) + 2) continue;
      const cx = ce[i * 2];
      const cy = ce[i * 2 + 1];
      let peak = 0;
      let signed = 0;
      const x0 = st[i * 5];
      const y0 = st[i * 5 + 1];
      for (let y = y0; y < y0 + bh; y++) {
        for (let x = x0; x < x0 + bw; x++) {
          const val = sd[y * sw + x];
          if (Math.abs(val) > peak) {
            peak = Math.abs(val);
            signed = val;
          }
        }
      }
      out.push({
        u: (cx + 0.5) * s,
        v: (cy + 0.5) * s,
        area,
        bboxLeft: st[i * 5] * s,
        bboxTop: st[i * 5 + 1] * s,
        bboxWidth: bw * s,
        bboxHeight: bh * s,
        polarity: signed < 0 ? 1 : -1,
        peak,
        label: i,
      });
    }
    return out;
  }

  /**
   * Differences inside a window of the current frame: contrast D = polarity ×
   * (background − frame), smoothed, thresholded, and split into components.
   * Returns the components (full-resolution centroids from OpenCV's stats).
   */
  measureWindow(centreU: number, centreV: number, half: number, polarity: 1 | -1): { rect: Rect; blobs: Blob[] } | null {
    const cv = this.cv;
    const x0 = Math.max(0, Math.floor(centreU - half));
    const y0 = Math.max(0, Math.floor(centreV - half));
    const x1 = Math.min(this.width, Math.ceil(centreU + half));
    const y1 = Math.min(this.height, Math.ceil(centreV + half));
    if (x1 - x0 < 3 || y1 - y0 < 3) return null;
    const rect = { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
    const cvRect = new cv.Rect(rect.x, rect.y, rect.width, rect.height);
    const fr = this.frame.roi(cvRect);
    const br = this.bg.roi(cvRect);
    const tr = this.thrFull.roi(cvRect);
    const sr = this.spread.roi(cvRect);
    const spread = new cv.Mat();
    const f = new cv.Mat();
    const bgc = new cv.Mat();
    const d = new cv.Mat();
    const db = new cv.Mat();
    const t8 = new cv.Mat();
    const labels = new cv.Mat();
    const stats = new cv.Mat();
    const cents = new cv.Mat();
    try {
      fr.convertTo(f, cv.CV_32F, this.gain);
      br.copyTo(bgc);
      if (polarity === 1) cv.subtract(bgc, f, d);
      else cv.subtract(f, bgc, d);
      cv.GaussianBlur(d, db, new cv.Size(3, 3), 0, 0, cv.BORDER_REPLICATE);
      cv.compare(db, tr, t8, cv.CMP_GT);
      sr.copyTo(spread);
      const n = cv.connectedComponentsWithStats(t8, labels, stats, cents, 8, cv.CV_32S);
      const st = stats.data32S;
      const ce = cents.data64F;
      const dbd = db.data32F;
      const lab = labels.data32S;
      const blobs: Blob[] = [];
      for (let i = 1; i < n; i++) {
        const bx = st[i * 5];
        const by = st[i * 5 + 1];
        const bw = st[i * 5 + 2];
        const bh = st[i * 5 + 3];
        let peak = 0;
        for (let y = by; y < by + bh; y++) for (let x = bx; x < bx + bw; x++) if (lab[y * rect.width + x] === i && dbd[y * rect.width + x] > peak) peak = dbd[y * rect.width + x];
        blobs.push({
          u: rect.x + ce[i * 2] + 0.5,
          v: rect.y + ce[i * 2 + 1] + 0.5,
          area: st[i * 5 + 4],
          bboxLeft: rect.x + bx,
          bboxTop: rect.y + by,
          bboxWidth: bw,
          bboxHeight: bh,
          polarity,
          peak,
          label: i,
        });
      }
      this.win = {
        rect,
        d: Float32Array.from(d.data32F),
        db: Float32Array.from(dbd),
        labels: Int32Array.from(lab),
        f: Float32Array.from(f.data32F),
        bg: Float32Array.from(bgc.data32F),
        spread: Float32Array.from(spread.data32F),
        polarity,
      };
      return { rect, blobs };
    } finally {
      for (const m of [fr, br, tr, sr, spread, f, bgc, d, db, t8, labels, stats, cents]) m.delete();
    }
  }

  /**
   * Sub-pixel centre of one component of the last window: the first moment of
   * its coverage. Coverage at a pixel is its contrast over the contrast a fully
   * covered pixel would have there (background − projectile gray), so a
   * textured background (foliage behind the ball) does not pull the centre
   * toward the pixels where the backdrop happens to contrast more. The mask is
   * the component grown by 2 px, so the faint rim below threshold still counts.
   */
  centroidOf(label: number, shape: { radiusPx: number; du: number; dv: number; blurPx: number }, start: { u: number; v: number }): Centroid | null {
    const cv = this.cv;
    const w = this.win;
    if (!w) return null;
    const { rect, d, labels, f, bg, spread, polarity } = w;
    const n = rect.width * rect.height;
    const mask = new cv.Mat(rect.height, rect.width, cv.CV_8UC1, new cv.Scalar(0));
    const grown = new cv.Mat();
    const weights = new cv.Mat(rect.height, rect.width, cv.CV_32FC1, new cv.Scalar(0));
    try {
      // The projectile's own gray: mean of the frame at the three strongest pixels of the component.
      const strongest: { c: number; i: number }[] = [];
      for (let i = 0; i < n; i++) {
        if (labels[i] !== label) continue;
        mask.data[i] = 255;
        strongest.push({ c: d[i], i });
      }
      if (strongest.length === 0) return null;
      strongest.sort((a, b) => b.c - a.c);
      const top = strongest.slice(0, Math.min(3, strongest.length));
      const ballGray = top.reduce((s, t) => s + f[t.i], 0) / top.length;
      const peak = top[0].c;
      cv.dilate(mask, grown, this.kernel);
      const g = grown.data;
      const floor = Math.max(0.35 * peak, 3 * this.noise.raw);
      const coverage = new Float32Array(n);
      let touches = false;
      for (let i = 0; i < n; i++) {
        if (!g[i]) continue;
        const full = Math.max(floor, polarity * (bg[i] - ballGray));
        const c = d[i] / full;
        coverage[i] = c < -0.3 ? -0.3 : c > 1.3 ? 1.3 : c;
        const x = i % rect.width;
        const y = (i - x) / rect.width;
        if ((x === 0 && rect.x === 0) || (y === 0 && rect.y === 0) || (x === rect.width - 1 && rect.x + rect.width === this.width) || (y === rect.height - 1 && rect.y + rect.height === this.height)) {
          if (coverage[i] > 0.2) touches = true;
        }
      }
      // Passes inside an ellipse (long along the motion, for blur): a component that grew into
      // something next to the projectile (a post's edge, compression ringing in foliage) would
      // pull a centre taken over the whole component; the ellipse cuts that off.
      const cutPer = 2.5 / Math.max(1, peak);
      const speed = Math.hypot(shape.du, shape.dv);
      const eu = speed > 0 ? shape.du / speed : 1;
      const ev = speed > 0 ? shape.dv / speed : 0;
      const across = 1.3 * shape.radiusPx + 1.5;
      const along = across + 0.5 * shape.blurPx;
      // First ellipse around the prediction (good to a pixel or so once tracking), then around each new centre.
      let cx = start.u - rect.x - 0.5;
      let cy = start.v - rect.y - 0.5;
      let m: ReturnType<typeof cv.moments> | null = null;
      const wd = weights.data32F;
      for (let pass = 0; pass < 3; pass++) {
        for (let i = 0; i < n; i++) {
          if (!g[i]) continue;
          const x = (i % rect.width) - cx;
          const y = Math.floor(i / rect.width) - cy;
          const a = (x * eu + y * ev) / along;
          const b = (-x * ev + y * eu) / across;
          // Soft threshold (subtract, do not cut): noise in the rim stops counting, a symmetric blob keeps its centre.
          const w = coverage[i] - Math.min(0.3, cutPer * Math.max(this.noise.raw, spread[i]));
          wd[i] = a * a + b * b <= 1 && w > 0 ? w : 0;
        }
        m = cv.moments(weights, false);
        if (!(m.m00 > 0)) return null;
        cx = m.m10 / m.m00;
        cy = m.m01 / m.m00;
      }
      if (!m) return null;
      let spreadSum = 0;
      let spreadN = 0;
      let seen = 0;
      for (let i = 0; i < n; i++) {
        if (!g[i]) continue;
        const x = (i % rect.width) - cx;
        const y = Math.floor(i / rect.width) - cy;
        const a = (x * eu + y * ev) / along;
        const b = (-x * ev + y * eu) / across;
        if (a * a + b * b > 1) continue;
        seen += coverage[i];
        spreadSum += spread[i];
        spreadN++;
      }
      const mu20 = m.mu20 / m.m00;
      const mu02 = m.mu02 / m.m00;
      const mu11 = m.mu11 / m.m00;
      const tr = (mu20 + mu02) / 2;
      const disc = Math.sqrt(Math.max(0, ((mu20 - mu02) / 2) ** 2 + mu11 * mu11));
      return {
        u: rect.x + cx + 0.5,
        v: rect.y + cy + 0.5,
        coverage: seen,
        majorPx: Math.sqrt(Math.max(0, tr + disc)),
        minorPx: Math.sqrt(Math.max(0, tr - disc)),
        touchesFrameEdge: touches,
        localSpread: spreadN ? spreadSum / spreadN : 0,
      };
    } finally {
      mask.delete();
      grown.delete();
      weights.delete();
    }
  }
}
