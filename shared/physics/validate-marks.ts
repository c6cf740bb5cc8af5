// Input checks shared by fitShot and the CSV reader, with one-line messages.
import type { FitMark } from './types';

/** Parameters of the drag model; a fit needs at least this many marks. */
export const DRAG_MODEL_PARAMETER_COUNT = 5;

export class FitInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FitInputError';
  }
}

export function validateMarks(marks: FitMark[]): void {
  if (!Array.isArray(marks)) throw new FitInputError('marks must be an array');
  if (marks.length < DRAG_MODEL_PARAMETER_COUNT) {
    throw new FitInputError(
      `need at least ${DRAG_MODEL_PARAMETER_COUNT} marks (the drag model has ${DRAG_MODEL_PARAMETER_COUNT} parameters), got ${marks.length}`,
    );
  }
  marks.forEach((m, i) => {
    for (const key of ['tS', 'xM', 'yM'] as const) {
      if (typeof m[key] !== 'number' || !Number.isFinite(m[key])) throw new FitInputError(`mark ${i + 1}: ${key} is not a finite number`);
    }
    if (m.sigmaM !== undefined && !(Number.isFinite(m.sigmaM) && m.sigmaM > 0)) {
      throw new FitInputError(`mark ${i + 1}: sigmaM must be a positive number`);
    }
    if (i > 0 && !(m.tS > marks[i - 1].tS)) {
      throw new FitInputError(`mark ${i + 1}: time ${m.tS} s is not after the previous mark (${marks[i - 1].tS} s)`);
    }
  });
  const withSigma = marks.filter((m) => m.sigmaM !== undefined).length;
  if (withSigma !== 0 && withSigma !== marks.length) throw new FitInputError('sigmaM must be given for every mark or for none');
}

export function requirePositive(name: string, value: number): void {
  if (typeof value !== 'number' || !(Number.isFinite(value) && value > 0)) {
    throw new FitInputError(`${name} must be a positive number`);
  }
}
