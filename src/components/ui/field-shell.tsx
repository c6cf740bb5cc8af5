import type { ReactNode } from 'react';
import { cx } from './cx';

export interface FieldShellProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  required?: boolean;
  className?: string;
  children: ReactNode;
}

/** Ids the control should point at with aria-describedby, so hints and errors are read with it. */
export function describedBy(id: string, hint: unknown, error: unknown): string | undefined {
  const ids = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean);
  return ids.length ? ids.join(' ') : undefined;
}

/** Label above, control, then hint and error below: the same layout for every field. */
export function FieldShell({ id, label, hint, error, required, className, children }: FieldShellProps) {
  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="text-micro font-medium uppercase tracking-wide text-ink-soft">
        {label}
        {required && (
          <span aria-hidden className="ml-0.5 text-signal-dark">
            *
          </span>
        )}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-micro text-ink-faint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-micro font-medium text-alert">
          {sentence(error)}
        </p>
      )}
    </div>
  );
}

/** Schema messages are fragments ("is required"); under a label they read better as a sentence. */
export function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1);
}

export function controlClasses(invalid: boolean, className?: string): string {
  return cx(
    'w-full rounded-md border bg-paper-raised px-2.5 text-body text-ink placeholder:text-ink-faint/70',
    'disabled:cursor-not-allowed disabled:bg-paper-sunk disabled:text-ink-faint',
    invalid ? 'border-alert' : 'border-line hover:border-ink-faint',
    className,
  );
}
