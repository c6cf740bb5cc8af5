import { useEffect, useState } from 'react';
import { useController, type Control, type FieldValues, type Path } from 'react-hook-form';
import { TextField } from '@/components/ui/text-field';

export interface QuantityFieldProps<T extends FieldValues> {
  control: Control<T>;
  name: Path<T>;
  label: string;
  /** Unit the person types in, e.g. "kPa". */
  unit: string;
  /** SI value = typed value × scale (1000 for kPa → Pa). */
  scale?: number;
  /** Allowed range in SI, to restate a range error in the typed unit. */
  bounds?: readonly [number, number];
  hint?: string;
  required?: boolean;
  step?: string;
}

/**
 * A number input that shows one unit and stores another: the API and the form
 * values stay SI (Pa, m), while people read gauges in kPa or bar. Empty means null.
 */
export function QuantityField<T extends FieldValues>({ control, name, label, unit, scale = 1, bounds, hint, required, step = 'any' }: QuantityFieldProps<T>) {
  const { field, fieldState } = useController({ control, name });
  const toText = (value: unknown) => (typeof value === 'number' && Number.isFinite(value) ? String(round(value / scale)) : '');
  const [text, setText] = useState(() => toText(field.value));

  // Follow outside changes (form reset, loaded record) without fighting the person's typing.
  useEffect(() => {
    const parsed = parse(text);
    const current = parsed === null ? null : parsed * scale;
    if (!sameNumber(current, field.value as number | null)) setText(toText(field.value));
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only react to the stored value
  }, [field.value]);

  let error = fieldState.error?.message;
  if (error && bounds && /between/.test(error)) error = `must be between ${round(bounds[0] / scale)} and ${round(bounds[1] / scale)} ${unit}`;
  if (error && bounds && /more than 0/.test(error)) error = `must be more than 0 and at most ${round(bounds[1] / scale)} ${unit}`;
  if (error && /expected number|must be a (finite )?number/i.test(error)) error = field.value === null && required ? 'is required' : `must be a number in ${unit}`;

  return (
    <TextField
      label={`${label} (${unit})`}
      inputMode="decimal"
      type="text"
      step={step}
      name={field.name}
      ref={field.ref}
      value={text}
      required={required}
      hint={hint}
      error={error}
      onBlur={field.onBlur}
      onChange={(e) => {
        setText(e.target.value);
        const parsed = parse(e.target.value);
        // Text that is not a number is passed on as NaN so the schema reports it instead of silently dropping it.
        field.onChange(parsed === null ? null : Number.isNaN(parsed) ? Number.NaN : round(parsed * scale));
      }}
    />
  );
}

/** Accepts a decimal comma too, as many locales type it. */
function parse(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(trimmed) ? Number(trimmed) : Number.NaN;
}

/** Removes binary noise from ×1000 and ÷1000 (e.g. 0.1 × 3 → 0.30000000000000004). */
function round(value: number): number {
  return Number(value.toPrecision(12));
}

function sameNumber(a: number | null, b: number | null | undefined): boolean {
  if (a === null || b === null || b === undefined) return a === null && (b === null || b === undefined);
  if (Number.isNaN(a) && Number.isNaN(b)) return true;
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a));
}
