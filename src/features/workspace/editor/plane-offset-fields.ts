// The plane-offset fields as typed (metres, decimal comma allowed) → the
// draft's offset, nothing stated, or the plain reason they do not add up; the
// geometry check is the server's own (shared/geometry/plane-offset.ts).
import { checkPlaneOffset } from '@shared/geometry/plane-offset';
import { GeometryError } from '@shared/geometry/points';
import { parseTyped } from './typed-number';
import type { PlaneOffsetDraft } from './types';

export interface PlaneOffsetFields {
  distance: string;
  distanceTol: string;
  offset: string;
  offsetTol: string;
}


const orZero = (text: string) => (text.trim() === '' ? 0 : parseTyped(text));

export function readPlaneOffset(fields: PlaneOffsetFields): { ok: true; offset: PlaneOffsetDraft | null } | { ok: false; message: string } {
  if (Object.values(fields).every((f) => f.trim() === '')) return { ok: true, offset: null };
  const offset: PlaneOffsetDraft = {
    planeDistanceM: parseTyped(fields.distance),
    planeDistanceTolM: orZero(fields.distanceTol),
    referenceOffsetM: orZero(fields.offset),
    referenceOffsetTolM: orZero(fields.offsetTol),
  };
  if (Number.isNaN(offset.planeDistanceM)) return { ok: false, message: 'Enter the camera’s distance to the flight plane in metres.' };
  try {
    checkPlaneOffset(offset);
  } catch (err) {
    if (err instanceof GeometryError) return { ok: false, message: err.message };
    throw err;
  }
  return { ok: true, offset };
}
