import { useId } from 'react';
import { cx } from './cx';

export interface SegmentOption<V extends string> {
  value: V;
  label: string;
  disabled?: boolean;
}

export interface SegmentedControlProps<V extends string> {
  /** Read out as the group's name; shown only when showLabel is set. */
  label: string;
  showLabel?: boolean;
  options: readonly SegmentOption<V>[];
  value: V;
  onChange: (value: V) => void;
  size?: 'sm' | 'md';
  className?: string;
}

/**
 * One choice out of a few, side by side. Built from real radio inputs, so
 * arrow keys move between segments and forms/screen readers understand it.
 */
export function SegmentedControl<V extends string>({ label, showLabel = false, options, value, onChange, size = 'md', className }: SegmentedControlProps<V>) {
  const name = useId();
  return (
    <fieldset className={cx('inline-flex flex-col gap-1', className)}>
      <legend className={showLabel ? 'mb-1 text-micro font-medium uppercase tracking-wide text-ink-soft' : 'sr-only'}>{label}</legend>
      <div className="inline-flex rounded-md border border-line bg-paper-sunk p-0.5">
        {options.map((o) => {
          const checked = o.value === value;
          return (
            <label
              key={o.value}
              className={cx(
                'relative cursor-pointer rounded-[5px] font-medium select-none has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-signal',
                size === 'sm' ? 'px-2.5 py-0.5 text-micro' : 'px-3 py-1 text-body',
                checked ? 'bg-paper-raised text-ink shadow-sm ring-1 ring-line' : 'text-ink-soft hover:text-ink',
                o.disabled && 'cursor-not-allowed opacity-50',
              )}
            >
              <input
                type="radio"
                className="sr-only"
                name={name}
                value={o.value}
                checked={checked}
                disabled={o.disabled}
                onChange={() => onChange(o.value)}
              />
              {o.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}
