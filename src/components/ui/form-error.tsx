import { ApiError } from '@/lib/api-client';
import { problemSummary } from '@/lib/form-errors';

export interface FormErrorProps {
  /** Whatever a mutation or query threw; nothing renders while it is null. */
  error: unknown;
  /** Field errors already shown beside their inputs are left out here. */
  hideFields?: readonly string[];
  className?: string;
}

/** Turns "body.email" into "email": the part of the request is noise to the reader. */
export function fieldName(path: string): string {
  return path.replace(/^(body|query|params)\./, '');
}

/** Plain words for a failed request, with the server's own explanation when it gave one. */
export function errorMessage(error: unknown, placedBesideFields: readonly string[] = []): string {
  if (error instanceof ApiError) {
    if (error.status === 429) return error.detail || 'Too many attempts. Wait a while and try again.';
    return problemSummary(error, placedBesideFields);
  }
  if (error instanceof TypeError) return 'Could not reach the Arcbench server. Check the connection and try again.';
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}

export function FormError({ error, hideFields = [], className }: FormErrorProps) {
  if (!error) return null;
  // The summary already names every field not shown beside its input, in plain words.
  return (
    <div role="alert" className={`rounded-md border border-alert/40 bg-alert-light/60 px-3 py-2 text-body text-alert ${className ?? ''}`}>
      <p className="font-medium">{errorMessage(error, hideFields)}</p>
    </div>
  );
}
