import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Puts the API's field errors (paths like "body.email") beside the matching
 * inputs. Returns the names it placed, so FormError can leave those out.
 */
export function applyApiFieldErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fieldNames: readonly Path<T>[]): string[] {
  if (!(error instanceof ApiError)) return [];
  const placed: string[] = [];
  for (const field of error.fields) {
    const name = field.path.replace(/^body\./, '') as Path<T>;
    if (fieldNames.includes(name)) {
      setError(name, { type: 'server', message: field.message });
      placed.push(name);
    }
  }
  return placed;
}
