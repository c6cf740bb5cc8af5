import { describe, expect, it } from 'vitest';
import { distort, lensModelForFrame } from '@shared/geometry/lens-distortion';
import { fitLensToEdges } from './lens-edge-fit';
import type { Point } from './types';

const frame = { widthPx: 640, heightPx: 480 };

/** An edge straight in the world from a to b, as a lens with this k1 shows it (Brown–Conrady closed form, shared distort). */
function bent(k1: number, a: Point, b: Point, n = 7): Point[] {
  const m = lensModelForFrame(frame.widthPx, frame.heightPx, { k1, k2: 0 });
  return Array.from({ length: n }, (_, i) => distort(m, { u: a.u + ((b.u - a.u) * i) / (n - 1), v: a.v + ((b.v - a.v) * i) / (n - 1) }));
}
const edges = (k1: number) => [
  bent(k1, { u: 20, v: 450 }, { u: 620, v: 460 }),
  bent(k1, { u: 30, v: 30 }, { u: 610, v: 20 }),
  bent(k1, { u: 40, v: 20 }, { u: 50, v: 460 }),
  bent(k1, { u: 600, v: 20 }, { u: 590, v: 460 }),
];

describe('lens fit before saving', () => {
  it('recovers a known barrel k1 from exact clicks, in the shape the server answers with', () => {
    const r = fitLensToEdges(edges(-0.12), frame);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.lens).toMatchObject({ model: 'brown-conrady-radial', source: 'straight-lines', frameWidthPx: 640, frameHeightPx: 480 });
    expect(r.lens.k1).toBeCloseTo(-0.12, 5);
    expect(r.lens.residualRmsPx).toBeLessThan(1e-3);
    expect(r.lens.k1StdUnc).toBeGreaterThan(0);
    expect(r.lens.straightLines).toHaveLength(4);
  });

  it('refuses edges that determine nothing with the plain message the server gives', () => {
    const one = fitLensToEdges(edges(-0.1).slice(0, 1), frame);
    expect(one).toEqual({ ok: false, message: expect.stringMatching(/at least 2 straight edges/) });
    const throughCentre = fitLensToEdges([
      [{ u: 20, v: 20 }, { u: 320, v: 240 }, { u: 620, v: 460 }],
      [{ u: 320, v: 10 }, { u: 320, v: 240 }, { u: 320, v: 470 }],
    ], frame);
    expect(throughCentre).toMatchObject({ ok: false, message: expect.stringMatching(/centre/) });
  });
});
