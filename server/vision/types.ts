// The auto-mark contract (docs: /work/team/automark-interface.md). The job,
// API and UI call only autoMarkTrack with these shapes.

export interface GrayFrame {
  frameNumber: number;
  width: number;
  height: number;
  /** 8-bit luma, row-major, width*height bytes. */
  data: Uint8Array;
}

/** Random access to a clip's decoded frames, numbered 0 … frameCount-1. */
export interface FrameSource {
  frameCount: number;
  width: number;
  height: number;
  read(frameNumber: number): Promise<GrayFrame>;
}

export interface AutoMarkSeed {
  frameNumber: number;
  uPx: number;
  vPx: number;
}

export interface AutoMark {
  frameNumber: number;
  /** Centre, sub-pixel, frame pixels (u right, v down; pixel (i, j) covers [i, i+1) × [j, j+1)). */
  uPx: number;
  vPx: number;
  confidence: number;
  /** Short plain reason when confidence is low; else null. */
  reason: string | null;
}

export interface AutoMarkOptions {
  seed?: AutoMarkSeed;
  originHint?: { uPx: number; vPx: number } | null;
  fromFrame?: number;
  toFrame?: number;
  signal?: AbortSignal;
  onProgress?: (fraction: number) => void;
  onMark?: (mark: AutoMark) => void | Promise<void>;
}

export type AutoMarkEndReason = 'left-frame' | 'lost' | 'end-of-clip';

export interface AutoMarkOutcome {
  /** Ascending frameNumber, no frame twice, none on frames where the projectile is hidden. */
  marks: AutoMark[];
  /** First frame of flight, or null when the clip (range) starts with the projectile already flying or it was never found. */
  launchFrame: number | null;
  endReason: AutoMarkEndReason;
}

/** Marks below this confidence are flagged for review (the team may choose another threshold). */
export const DEFAULT_REVIEW_THRESHOLD = 0.6;
