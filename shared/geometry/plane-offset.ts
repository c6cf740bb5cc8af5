// Scale reference off the flight plane.
//
// Pinhole camera (Hartley & Zisserman, Multiple View Geometry, 2nd ed., §6.1):
// a length L square to the optical axis at distance Z images to f·L/Z pixels,
// so pixels per metre fall off as 1/Z. A scale reference at distance D − δ
// (δ > 0: nearer the camera than the flight plane) therefore reads
//     ppm_ref = f / (D − δ),   while the flight plane has   ppm_plane = f / D,
//     ppm_plane = ppm_ref · (D − δ) / D.
// A reference 0.1 m in front of a plane 10 m away reads 1 % too many pixels per
// metre, so every length — and the speed — would come out 1 % short.
//
// Uncertainty (GUM, JCGM 100:2008, §5.1.2, first order): the ratio
// ρ = 1 − δ/D has ∂ρ/∂δ = −1/D and ∂ρ/∂D = δ/D², so
//     u(ρ)/ρ = √( (u_δ/D)² + (δ·u_D/D²)² ) / ρ.
// Tolerances ±a are rectangular distributions, u = a/√3 (GUM §4.3.7).
import { rectangularStdUncertainty } from '../uncertainty/gum';
import { GeometryError } from './points';

export interface PlaneOffsetInput {
  /** Camera to flight plane, along the optical axis, m. */
  planeDistanceM: number;
  /** ± tolerance of that distance, m (rectangular). */
  planeDistanceTolM: number;
  /** Scale reference's offset from the flight plane, m, positive towards the camera. */
  referenceOffsetM: number;
  /** ± tolerance of the offset, m (rectangular). */
  referenceOffsetTolM: number;
}

export interface PlaneOffsetResult {
  /** ppm_plane / ppm_ref = (D − δ) / D. */
  factor: number;
  /** u(factor) / factor. */
  relStdUncertainty: number;
  /** Parts of the relative uncertainty, for the breakdown. */
  fromOffset: number;
  fromDistance: number;
}

/** Refuses an offset geometry that has no meaning, with a plain message naming the field. */
export function checkPlaneOffset(input: PlaneOffsetInput): void {
  const { planeDistanceM: D, planeDistanceTolM: aD, referenceOffsetM: d, referenceOffsetTolM: ad } = input;
  if (!(Number.isFinite(D) && D > 0)) throw new GeometryError('The camera-to-plane distance must be a positive number of metres.', 'planeOffset.planeDistanceM');
  if (!(Number.isFinite(aD) && aD >= 0 && aD < D)) {
    throw new GeometryError('The distance tolerance must be 0 or more and smaller than the distance.', 'planeOffset.planeDistanceTolM');
  }
  if (!Number.isFinite(d)) throw new GeometryError('The reference offset must be a number of metres.', 'planeOffset.referenceOffsetM');
  if (!(Math.abs(d) < D)) {
    throw new GeometryError(
      'The reference offset is as large as the camera-to-plane distance: the reference would stand at or behind the camera. Check both numbers.',
      'planeOffset.referenceOffsetM',
    );
  }
  if (!(Number.isFinite(ad) && ad >= 0 && ad < D)) {
    throw new GeometryError('The offset tolerance must be 0 or more and smaller than the distance.', 'planeOffset.referenceOffsetTolM');
  }
}

export function planeOffsetFactor(input: PlaneOffsetInput): PlaneOffsetResult {
  checkPlaneOffset(input);
  const { planeDistanceM: D, referenceOffsetM: d } = input;
  const uD = rectangularStdUncertainty(input.planeDistanceTolM);
  const ud = rectangularStdUncertainty(input.referenceOffsetTolM);
  const factor = (D - d) / D;
  const fromOffset = ud / D / factor;
  const fromDistance = (Math.abs(d) * uD) / (D * D) / factor;
  return { factor, relStdUncertainty: Math.hypot(fromOffset, fromDistance), fromOffset, fromDistance };
}

/** Pixels per metre in the flight plane from pixels per metre measured at the reference. */
export function planePixelsPerMetre(referencePixelsPerMetre: number, input: PlaneOffsetInput): number {
  return referencePixelsPerMetre * planeOffsetFactor(input).factor;
}
