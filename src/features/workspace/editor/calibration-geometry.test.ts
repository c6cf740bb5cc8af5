import { describe, expect, it } from 'vitest';
import { CLICK_SIGMA_PX } from '@shared/defaults';
import { buildCalibrationTransform } from '@shared/geometry/calibration-transform';
import type { Calibration } from '@shared/schemas/marking';
import { calibrationToDraft, draftToCreateBody, draftToGeometry, sameDraft, transformOfDraft } from './calibration-geometry';
import { EMPTY_CALIBRATION, type CalibrationDraft, type LensDraft } from './types';

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

  const stated: LensDraft = {
    model: 'brown-conrady-radial', source: 'coefficients', k1: -0.08, k2: 0.01, k1StdUnc: 0.002, k2StdUnc: 0.001, k1k2Correlation: -0.9,
    residualRmsPx: null, terms: null, straightLines: null, notes: [], frameWidthPx: 640, frameHeightPx: 480,
  };
  const edges = [[{ u: 20, v: 450 }, { u: 320, v: 470 }, { u: 620, v: 450 }], [{ u: 20, v: 30 }, { u: 320, v: 10 }, { u: 620, v: 30 }]];
  const fitted: LensDraft = { ...stated, source: 'straight-lines', k1: -0.1004, k2: 0, residualRmsPx: 0.2, terms: 1, straightLines: edges };

  it('sends fitted edges as edges and stated coefficients as stated, with the offset and level uncertainty', () => {
    const offset = { planeDistanceM: 10, planeDistanceTolM: 0.5, referenceOffsetM: 0.2, referenceOffsetTolM: 0.05 };
    const body = draftToCreateBody({ ...draft, lens: fitted, planeOffset: offset, levelUncertainty: { rollTolDeg: 0.5 } })!;
    expect(body.lens).toEqual({ straightLines: edges, clickSigmaPx: 0.5 });
    expect(body.planeOffset).toEqual(offset);
    expect(body.levelUncertainty).toEqual({ rollTolDeg: 0.5 });
    expect(draftToCreateBody({ ...draft, lens: stated })!.lens).toEqual({ coefficients: { k1: -0.08, k2: 0.01, k1StdUnc: 0.002, k2StdUnc: 0.001, k1k2Correlation: -0.9 } });
    // A team profile is named, not copied: the server copies its coefficients when the version is saved.
    const profile = { ...stated, source: 'profile' as const, profile: { id: '00000000-0000-4000-8000-0000000000aa', name: 'Wide action cam' } };
    expect(draftToCreateBody({ ...draft, lens: profile })!.lens).toEqual({ profileId: '00000000-0000-4000-8000-0000000000aa' });
  });

  it('uses the plane offset in the preview transform: pixels per metre × (D − δ)/D (pinhole closed form)', () => {
    const r = transformOfDraft({ ...draft, planeOffset: { planeDistanceM: 10, planeDistanceTolM: 0, referenceOffsetM: 0.2, referenceOffsetTolM: 0 } });
    expect(r?.ok && r.transform.pixelsPerMetre).toBeCloseTo(196, 9);
  });

  it('compares lenses by their input: the server refitting the same edges, or unfitted clicks, are no change', () => {
    expect(sameDraft({ ...draft, lens: fitted }, { ...draft, lens: { ...fitted, k1: -0.1003 } })).toBe(true);
    expect(sameDraft({ ...draft, lens: fitted }, { ...draft, lens: { ...fitted, straightLines: edges.slice(0, 1) } })).toBe(false);
    expect(sameDraft(draft, { ...draft, straightLines: edges })).toBe(true);
    expect(sameDraft(draft, { ...draft, lens: stated })).toBe(false);
  });

  it('takes the level uncertainty the server stored, not a value reconstructed from the roll uncertainty', () => {
    const level = { kind: 'line' as const, p1: { u: 100, v: 400 }, p2: { u: 500, v: 404 } };
    const g = draftToGeometry({ ...draft, level, lens: stated, levelUncertainty: { endpointSigmaPx: 0.8 } })!;
    const t = buildCalibrationTransform(g);
    const saved = (over: Partial<Calibration>): Calibration => ({
      id: '00000000-0000-4000-8000-000000000001', clipId: '00000000-0000-4000-8000-000000000002', version: 1,
      scale: g.scale, origin: g.origin, level, downrange: 'right', plane: null, rollDeg: t.rollDeg,
      rollStdUncertaintyDeg: (t.rollStdUncertaintyRad * 180) / Math.PI, levelUncertainty: { endpointSigmaPx: 0.8 }, lens: stated, planeOffset: null,
      pixelsPerMetre: t.pixelsPerMetre, scaleRelUncertainty: t.scaleRelUncertainty, note: null, createdBy: null, createdAt: '2026-04-18T10:00:00Z',
      ...over,
    });
    expect(calibrationToDraft(saved({})).levelUncertainty).toEqual({ endpointSigmaPx: 0.8 });
    expect(sameDraft({ ...draft, level, lens: stated, levelUncertainty: { endpointSigmaPx: 0.8 } }, calibrationToDraft(saved({})))).toBe(true);
    // The stored tolerance comes through as typed even where the roll uncertainty says otherwise (a stated ± a gives u = a/√3, GUM §4.3.7).
    const angle = calibrationToDraft(saved({ level: { kind: 'angle', rollDeg: 1 }, rollStdUncertaintyDeg: 0.5 / Math.sqrt(3), levelUncertainty: { rollTolDeg: 0.7 } }));
    expect(angle.levelUncertainty).toEqual({ rollTolDeg: 0.7 });
    // A version saved before the input was stored: the draft states none, which means the defaults.
    const older = calibrationToDraft(saved({ levelUncertainty: null }));
    expect(older.levelUncertainty).toBeNull();
    expect(sameDraft(older, { ...older, levelUncertainty: { endpointSigmaPx: CLICK_SIGMA_PX } })).toBe(true);
  });
});
