import { useId, type ComponentProps, type ReactNode } from 'react';
import { FieldShell, controlClasses, describedBy } from './field-shell';

export interface TextareaFieldProps extends Omit<ComponentProps<'textarea'>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  id?: string;
  fieldClassName?: string;
}

export function TextareaField({ label, hint, error, id, required, rows = 3, className, fieldClassName, ...rest }: TextareaFieldProps) {
  const autoId = useId();
  const areaId = id ?? autoId;
  return (
    <FieldShell id={areaId} label={label} hint={hint} error={error} required={required} className={fieldClassName}>
      <textarea
        id={areaId}
        rows={rows}
        required={required}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(areaId, hint, error)}
        className={controlClasses(!!error, `py-1.5 ${className ?? ''}`)}
        {...rest}
      />
    </FieldShell>
  );
}
