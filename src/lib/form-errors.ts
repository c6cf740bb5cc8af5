import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/** "body.chamberPressurePa" → "chamberPressurePa": the part of the request is noise to the reader. */
export function fieldPath(path: string): string {
  return path.replace(/^(body|query|params)\./, '');
}

/** "chamberPressurePa" → "Chamber pressure", "note" → "Note": a field name as a person would say it. */
export function fieldLabel(path: string): string {
  const last = fieldPath(path).split('.').filter((p) => !/^\d+$/.test(p)).pop() ?? path;
  const words = last
    // unit and key suffixes of the wire names (shared/ spells units in names) are not words
    .replace(/(?<=[a-z])(Pa|Kpa|Mps|Kg|Deg|M|C|Pct|Id)$/, '')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_-]+/g, ' ')
    .trim()
    .toLowerCase();
  return words ? words[0].toUpperCase() + words.slice(1) : 'This field';
}

/** "is required when rejecting" on "body.note" → "Note is required when rejecting." */
export function plainFieldError(path: string, message: string): string {
  const text = message.trim().replace(/\.$/, '');
  return `${fieldLabel(path)} ${text}.`;
}

/** The message to show beside the field itself: the label is already there, so only the words. */
export function besideFieldMessage(message: string): string {
  const text = message.trim().replace(/\.$/, '');
  return text ? text[0].toUpperCase() + text.slice(1) + '.' : text;
}

/** The field error the server sent for one field, in plain words, or undefined. */
export function apiFieldError(error: unknown, name: string): string | undefined {
  if (!(error instanceof ApiError)) return undefined;
  const field = error.fields.find((f) => fieldPath(f.path) === name);
  return field ? besideFieldMessage(field.message) : undefined;
}

/**
 * The summary line of a failed request. A 400 with field errors carries a detail built for
 * logs ("Invalid request body: note is required when rejecting"); people get a plain sentence.
 */
export function problemSummary(error: ApiError, placedBesideFields: readonly string[] = []): string {
  if (error.status === 400 && error.fields.length > 0) {
    const rest = error.fields.filter((f) => !placedBesideFields.includes(fieldPath(f.path)));
    if (rest.length === 0) return error.fields.length === 1 ? 'Check the field marked below.' : 'Check the fields marked below.';
    return rest.map((f) => plainFieldError(f.path, f.message)).join(' ');
  }
  return error.detail || error.title || `The request failed (${error.status}).`;
}

/**
 * Puts the API's field errors (paths like "body.email") beside the matching
 * inputs. Returns the names it placed, so FormError can leave those out.
 */
export function applyApiFieldErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fieldNames: readonly Path<T>[]): string[] {
  if (!(error instanceof ApiError)) return [];
  const placed: string[] = [];
  for (const field of error.fields) {
    const name = fieldPath(field.path) as Path<T>;
    if (fieldNames.includes(name)) {
      setError(name, { type: 'server', message: besideFieldMessage(field.message) });
      placed.push(name);
    }
  }
  return placed;
}
