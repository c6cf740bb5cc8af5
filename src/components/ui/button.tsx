import type { ComponentProps } from 'react';
import { cx } from './cx';
import { Spinner } from './spinner';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'ghost';
export type ButtonSize = 'sm' | 'md' | 'lg';

const VARIANTS: Record<ButtonVariant, string> = {
  // Amber is reserved for what a person does, so the main action wears it.
  primary: 'bg-signal text-ink border-signal-dark/40 hover:bg-signal-dark hover:text-paper-raised',
  secondary: 'bg-paper-raised text-ink border-line hover:bg-paper-sunk',
  danger: 'bg-alert text-paper-raised border-alert hover:bg-alert/90',
  ghost: 'bg-transparent text-ink-soft border-transparent hover:bg-paper-sunk hover:text-ink',
};

const SIZES: Record<ButtonSize, string> = {
  sm: 'h-7 px-2.5 text-micro gap-1.5',
  md: 'h-9 px-3.5 text-body gap-2',
  lg: 'h-11 px-5 text-lead gap-2.5',
};

/** The class list of a button, for links that should look like one (see ButtonLink). */
export function buttonClasses(variant: ButtonVariant = 'secondary', size: ButtonSize = 'md', className?: string): string {
  return cx(
    'inline-flex items-center justify-center rounded-md border font-medium whitespace-nowrap transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-55',
    VARIANTS[variant],
    SIZES[size],
    className,
  );
}

export interface ButtonProps extends ComponentProps<'button'> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner and disables the button while an action runs. */
  busy?: boolean;
}

export function Button({ variant = 'secondary', size = 'md', busy = false, type = 'button', disabled, className, children, ...rest }: ButtonProps) {
  return (
    <button type={type} disabled={disabled || busy} aria-busy={busy || undefined} className={buttonClasses(variant, size, className)} {...rest}>
      {busy && <Spinner size="sm" label="" />}
      {children}
    </button>
  );
}
