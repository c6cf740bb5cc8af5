import { useId, type ComponentProps, type ReactNode } from 'react';
import { cx } from './cx';
import { describedBy, sentence } from './field-shell';

export interface CheckboxFieldProps extends Omit<ComponentProps<'input'>, 'id' | 'type'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  id?: string;
  fieldClassName?: string;
}

/** Box left, label right; the hint sits under the label. `ref` passes through for register(). */
export function CheckboxField({ label, hint, error, id, className, fieldClassName, ...rest }: CheckboxFieldProps) {
  const autoId = useId();
  const boxId = id ?? autoId;
  return (
    <div className={cx('flex items-start gap-2.5', fieldClassName)}>
      <input
        id={boxId}
        type="checkbox"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(boxId, hint, error)}
        className={cx('mt-0.5 size-4 shrink-0 rounded border-line accent-signal-dark', className)}
        {...rest}
      />
      <div className="flex flex-col gap-0.5">
        <label htmlFor={boxId} className="text-body text-ink">
          {label}
        </label>
        {hint && (
          <p id={`${boxId}-hint`} className="text-micro text-ink-faint">
            {hint}
          </p>
        )}
        {error && (
          <p id={`${boxId}-error`} className="text-micro font-medium text-alert">
            {sentence(error)}
          </p>
        )}
      </div>
    </div>
  );
}
