import { describe, expect, it } from 'vitest';
import { draftToCreateBody, sameDraft, transformOfDraft } from './calibration-geometry';
import { EMPTY_CALIBRATION, type CalibrationDraft } from './types';

const draft: CalibrationDraft = {
  ...EMPTY_CALIBRATION,
  scale: { p1: { u: 100, v: 500 }, p2: { u: 300, v: 500 }, lengthM: 1, lengthTolM: 0.002 },
  origin: { u: 100, v: 300 },
};

describe('calibration draft', () => {
  it('is incomplete without a scale or an origin', () => {
    expect(transformOfDraft(EMPTY_CALIBRATION)).toBeNull();
    expect(draftToCreateBody({ ...draft, origin: null })).toBeNull();
  });

  it('without a level line is sent as a 0° roll, and equals what the server sends back', () => {
    const body = draftToCreateBody(draft)!;
    expect(body.level).toEqual({ kind: 'angle', rollDeg: 0 });
    expect(sameDraft(draft, { ...draft, level: { kind: 'angle', rollDeg: 0 } })).toBe(true);
    expect(sameDraft(draft, { ...draft, level: { kind: 'angle', rollDeg: 1 } })).toBe(false);
  });

  it('maps pixels to metres by the closed form x = Δu / ppm, y = −Δv / ppm (200 px over a 1 m reference)', () => {
    const r = transformOfDraft(draft);
    expect(r?.ok).toBe(true);
    if (!r?.ok) return;
    expect(r.transform.pixelsPerMetre).toBeCloseTo(200, 12);
    const w = r.transform.imageToWorld({ u: 300, v: 100 });
    expect(w.x).toBeCloseTo(1, 12);
    expect(w.y).toBeCloseTo(1, 12);
  });

  it('explains a draft that defines no transform', () => {
    const r = transformOfDraft({ ...draft, scale: { ...draft.scale!, lengthTolM: 2 } });
    expect(r).toMatchObject({ ok: false });
  });
});
