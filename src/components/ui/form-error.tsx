import { ApiError } from '@/lib/api-client';

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
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 429) return error.detail || 'Too many attempts. Wait a while and try again.';
    return error.detail || error.title || `The request failed (${error.status}).`;
  }
  if (error instanceof TypeError) return 'Could not reach the Arcbench server. Check the connection and try again.';
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}

export function FormError({ error, hideFields = [], className }: FormErrorProps) {
  if (!error) return null;
  const fields = error instanceof ApiError ? error.fields.filter((f) => !hideFields.includes(fieldName(f.path))) : [];
  return (
    <div role="alert" className={`rounded-md border border-alert/40 bg-alert-light/60 px-3 py-2 text-body text-alert ${className ?? ''}`}>
      <p className="font-medium">{errorMessage(error)}</p>
      {fields.length > 0 && (
        <ul className="mt-1 list-disc pl-5 text-micro">
          {fields.map((f) => (
            <li key={f.path + f.message}>
              <span className="font-medium">{fieldName(f.path)}</span> {f.message}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
