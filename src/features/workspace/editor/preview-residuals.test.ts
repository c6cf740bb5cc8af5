import { describe, expect, it } from 'vitest';
import { STANDARD_GRAVITY_MPS2 } from '@shared/physics/constants';
import { flightPreview } from './flight-preview';
import { pathAt, previewResiduals } from './preview-residuals';

// A drag-free throw (closed form x = vx t, y = vy t − g t²/2) sampled at 240 fps:
// the preview's curve passes through the marks, so only a displaced mark stands out.
const G = STANDARD_GRAVITY_MPS2;
const marks = Array.from({ length: 40 }, (_, i) => {
  const t = i / 240;
  return { tS: t, xM: 12 * t, yM: 6 * t - 0.5 * G * t * t };
});

describe('preview residuals', () => {
  it('interpolates the sampled path and refuses times outside it', () => {
    const path = [
      { tS: 0, xM: 0, yM: 0 },
      { tS: 1, xM: 2, yM: 4 },
    ];
    expect(pathAt(path, 0.25)).toEqual({ xM: 0.5, yM: 1 });
    expect(pathAt(path, 1.5)).toBeNull();
  });

  it('points out a mark that sits off the curve, and only that one', () => {
    const bumped = marks.map((m, i) => (i === 17 ? { ...m, yM: m.yM + 0.03 } : m));
    const preview = flightPreview(bumped, 40 / 240);
    const res = previewResiduals(bumped, preview, 0.005);
    expect(res.filter((r) => r.outOfLine).map((r) => r.tS)).toEqual([17 / 240]);
  });

  it('flags nothing on clean marks, even where the scatter is tiny', () => {
    const preview = flightPreview(marks, 40 / 240);
    expect(previewResiduals(marks, preview, 0.005).some((r) => r.outOfLine)).toBe(false);
  });
});
