import { useId, type ComponentProps, type ReactNode } from 'react';
import { FieldShell, controlClasses, describedBy } from './field-shell';

export interface SelectOption {
  value: string;
  label: string;
  disabled?: boolean;
}

export interface SelectFieldProps extends Omit<ComponentProps<'select'>, 'id' | 'children'> {
  label: ReactNode;
  options: readonly SelectOption[];
  hint?: ReactNode;
  error?: string;
  /** A first, empty choice such as "Choose…". */
  placeholder?: string;
  id?: string;
  fieldClassName?: string;
}

export function SelectField({ label, options, hint, error, placeholder, id, required, className, fieldClassName, ...rest }: SelectFieldProps) {
  const autoId = useId();
  const selectId = id ?? autoId;
  return (
    <FieldShell id={selectId} label={label} hint={hint} error={error} required={required} className={fieldClassName}>
      <select
        id={selectId}
        required={required}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(selectId, hint, error)}
        className={controlClasses(!!error, `h-9 pr-8 ${className ?? ''}`)}
        {...rest}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value} disabled={o.disabled}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}
