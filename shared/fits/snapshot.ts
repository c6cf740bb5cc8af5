// What a stored fit remembers about its inputs. `fitInput` is exactly what was
// handed to fitShot, so recomputing from it reproduces the result bit for bit;
// everything else says where those numbers came from (pixels, calibration,
// conditions) so a reviewer can trace each one.
import type { CalibrationGeometry } from '../geometry/calibration-transform';
import type { FrameStampPosition } from '../physics/exposure-timing';
import type { FitShotInput } from '../physics/types';
import type { WindRelativeToLine } from '../physics/wind';
import type { FitMarkCounts } from '../schemas/auto-mark';

export interface SnapshotMark {
  frameNumber: number;
  tS: number;
  uPx: number;
  vPx: number;
  xM: number;
  yM: number;
}

/** Where a standard uncertainty came from: a record, or a stated default. */
export interface UncertaintyNote {
  value: number;
  source: string;
}

export interface FitInputSnapshot {
  schemaVersion: 1;
  shot: {
    id: string;
    label: string;
    airTempC: number | null;
    stationPressurePa: number | null;
    relativeHumidityPct: number | null;
    chamberPressurePa: number | null;
    elevationDeg: number | null;
    /** Wind relative to the line of fire (absent on fits stored before shots recorded it). */
    wind?: WindRelativeToLine | null;
    launchHeightM?: number | null;
    /** Air density stated directly and its ± tolerance, kg/m³ (absent on older fits). */
    airDensityKgM3?: number | null;
    airDensityTolKgM3?: number | null;
  };
  projectile: { id: string; name: string; massKg: number; diameterM: number; referenceAreaM2: number | null };
  launcher: {
    id: string;
    name: string;
    boreM: number | null;
    barrelLengthM: number | null;
    chamberVolumeM3: number | null;
  } | null;
  clip: {
    id: string;
    frameRateHz: number | null;
    /** Exposure timing the mark-time shift came from (absent on fits stored before clips recorded it). */
    shutterS?: number | null;
    frameStamp?: FrameStampPosition;
  };
  calibration: {
    id: string;
    version: number;
    pixelsPerMetre: number;
    scaleRelUncertainty: number | null;
    /** Scale points, origin, level, direction and plane: rebuilds the px↔world transform (shared/geometry). */
    geometry: CalibrationGeometry;
    /** The calibration record as stored, for the report. */
    record: Record<string, unknown>;
  };
  track: { id: string; kind: string; marksRevision: number };
  marks: SnapshotMark[];
  /** How the marks were made and which automatic ones were left out (absent on fits stored before automatic marking). */
  markCounts?: FitMarkCounts;
  muzzle: { trackId: string; uPx: number; vPx: number; xM: number; yM: number } | null;
  air: {
    densityKgM3: number;
    temperatureK: number;
    /** How the density was obtained: from the shot's conditions or a standard atmosphere. */
    source: string;
  };
  uncertainties: {
    massKg: UncertaintyNote;
    diameterM: UncertaintyNote;
    airDensityKgM3: UncertaintyNote;
    scaleRelative: UncertaintyNote;
  };
  fitInput: FitShotInput;
}
