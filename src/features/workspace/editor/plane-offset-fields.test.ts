import { describe, expect, it } from 'vitest';
import { planeOffsetFactor } from '@shared/geometry/plane-offset';
import { readPlaneOffset } from './plane-offset-fields';

const empty = { distance: '', distanceTol: '', offset: '', offsetTol: '' };

describe('plane-offset fields', () => {
  it('all empty: nothing stated (the reference is taken to lie in the flight plane)', () => {
    expect(readPlaneOffset(empty)).toEqual({ ok: true, offset: null });
  });

  it('reads metres with a decimal comma and a typographic minus; empty tolerances are 0', () => {
    const r = readPlaneOffset({ distance: '10', distanceTol: '0,5', offset: '\u22120.2', offsetTol: '' });
    expect(r).toEqual({ ok: true, offset: { planeDistanceM: 10, planeDistanceTolM: 0.5, referenceOffsetM: -0.2, referenceOffsetTolM: 0 } });
    // Issue 12's example: a reference 0.1 m nearer the camera, seen from 10 m, reads 1 % too many pixels per metre.
    const near = readPlaneOffset({ ...empty, distance: '10', offset: '0.1' });
    expect(near.ok && planeOffsetFactor(near.offset!).factor).toBeCloseTo(0.99, 12);
  });

  it('refuses an offset as large as the distance, and a missing distance, in plain words', () => {
    expect(readPlaneOffset({ ...empty, distance: '2', offset: '3' })).toMatchObject({ ok: false, message: expect.stringMatching(/behind the camera/) });
    expect(readPlaneOffset({ ...empty, offset: '0.2' })).toMatchObject({ ok: false, message: expect.stringMatching(/distance to the flight plane/) });
    expect(readPlaneOffset({ ...empty, distance: '10', distanceTol: '-1' })).toMatchObject({ ok: false, message: expect.stringMatching(/tolerance/) });
  });
});
