import { useId, type ComponentProps, type ReactNode } from 'react';
import { FieldShell, controlClasses, describedBy } from './field-shell';

export interface TextFieldProps extends Omit<ComponentProps<'input'>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  /** Shown after the input, e.g. a unit such as "m/s". */
  suffix?: ReactNode;
  id?: string;
  fieldClassName?: string;
}

/** A labelled input. `ref` passes through (React 19), so react-hook-form's register() works directly. */
export function TextField({ label, hint, error, suffix, id, required, className, fieldClassName, ...rest }: TextFieldProps) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const input = (
    <input
      id={inputId}
      required={required}
      aria-invalid={error ? true : undefined}
      aria-describedby={describedBy(inputId, hint, error)}
      className={controlClasses(!!error, `h-9 ${rest.type === 'number' ? 'tabular-nums' : ''} ${className ?? ''}`)}
      {...rest}
    />
  );
  return (
    <FieldShell id={inputId} label={label} hint={hint} error={error} required={required} className={fieldClassName}>
      {suffix ? (
        <div className="flex items-center gap-2">
          {input}
          <span className="shrink-0 text-body text-ink-faint">{suffix}</span>
        </div>
      ) : (
        input
      )}
    </FieldShell>
  );
}
