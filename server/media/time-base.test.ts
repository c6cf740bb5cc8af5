// The time-base rules on hand-made timestamp lists, where the right answer is
// known by construction (closed forms: frame i of a constant-rate clip at i / fps).
import { describe, expect, it } from 'vitest';
import { analyseTimeBase, formatFps } from './time-base';

/** Interval pattern of a jittery camera clock (±20 % around the nominal). */
const JITTER = [0.8, 1.2, 1.0, 0.85, 1.15];
const cfr = (n: number, fps: number) => Array.from({ length: n }, (_, i) => i / fps);

describe('analyseTimeBase', () => {
  it('constant rate, same capture rate: t = i / fps, no warnings', () => {
    const tb = analyseTimeBase({ ptsS: cfr(100, 240), containerFps: 240, baseFps: 240, captureFps: 240 });
    expect(tb.variableFrameRate).toBe(false);
    expect(tb.warnings).toEqual([]);
    expect(tb.frames[99].tS).toBeCloseTo(99 / 240, 12);
  });

  it('slow motion (plays 30, captured 240): t = i / 240 and a rate warning', () => {
    const tb = analyseTimeBase({ ptsS: cfr(50, 30), containerFps: 30, baseFps: 30, captureFps: 240 });
    expect(tb.frames[49].tS).toBeCloseTo(49 / 240, 12);
    expect(tb.warnings).toEqual([{ code: 'rate-differs', message: 'Plays at 30 fps but was captured at 240 fps: times use 240 fps.' }]);
  });

  it('a dropped frame in a constant-rate file: later frames keep their slots and the gap is flagged', () => {
    const pts = cfr(20, 100).filter((_, i) => i !== 7);
    const tb = analyseTimeBase({ ptsS: pts, containerFps: 95, baseFps: 100, captureFps: 100 });
    expect(tb.frames[7].flag).toBe('dropped-before');
    expect(tb.frames[7].tS).toBeCloseTo(0.08, 12); // source slot 8
    expect(tb.variableFrameRate).toBe(false);
    expect(tb.warnings.map((w) => w.code)).toEqual(['dropped-frames']);
  });

  it('a repeated timestamp is flagged as a duplicate', () => {
    const pts = cfr(10, 50);
    pts.splice(4, 0, pts[4]);
    const tb = analyseTimeBase({ ptsS: pts, containerFps: 50, baseFps: 50, captureFps: 50 });
    expect(tb.frames[5].flag).toBe('duplicate');
    expect(tb.frames[5].tS).toBe(tb.frames[4].tS);
  });

  it('millisecond timestamps (Matroska) at 240 fps are not mistaken for a variable rate', () => {
    const pts = cfr(200, 240).map((t) => Math.round(t * 1000) / 1000);
    const tb = analyseTimeBase({ ptsS: pts, containerFps: 240, baseFps: 240, captureFps: 240 });
    expect(tb.variableFrameRate).toBe(false);
    expect(tb.frames[120].tS).toBeCloseTo(0.5, 12);
  });

  it('variable rate in real time: times are the timestamps', () => {
    const pts = [0];
    for (let i = 1; i < 60; i++) pts.push(pts[i - 1] + JITTER[i % 5] / 120);
    const tb = analyseTimeBase({ ptsS: pts, containerFps: 60 / pts[59], baseFps: 90000, captureFps: 120 });
    expect(tb.variableFrameRate).toBe(true);
    expect(tb.frames[59].tS).toBeCloseTo(pts[59], 12);
  });

  it('variable-rate slow motion: timestamps scaled by playback / capture', () => {
    const pts = [0];
    for (let i = 1; i < 60; i++) pts.push(pts[i - 1] + JITTER[i % 5] / 30);
    const playback = 59 / pts[59];
    const tb = analyseTimeBase({ ptsS: pts, containerFps: playback, baseFps: 90000, captureFps: 240 });
    expect(tb.variableFrameRate).toBe(true);
    expect(tb.frames[59].tS).toBeCloseTo((pts[59] * playback) / 240, 12);
    expect(tb.warnings.map((w) => w.code)).toContain('rate-differs');
  });

  it('formats rates plainly', () => {
    expect(formatFps(240)).toBe('240');
    expect(formatFps(30000 / 1001)).toBe('29.97');
  });
});
