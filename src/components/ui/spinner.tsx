import { cx } from './cx';

export interface SpinnerProps {
  size?: 'sm' | 'md' | 'lg';
  /** Read out to screen readers; pass '' when a surrounding element already says what is happening. */
  label?: string;
  className?: string;
}

const SIZES = { sm: 'size-3.5 border-2', md: 'size-5 border-2', lg: 'size-8 border-[3px]' } as const;

export function Spinner({ size = 'md', label = 'Loading…', className }: SpinnerProps) {
  return (
    <span role={label ? 'status' : undefined} className={cx('inline-flex items-center gap-2 text-ink-faint', className)}>
      <span aria-hidden className={cx('inline-block animate-spin rounded-full border-current border-r-transparent', SIZES[size])} />
      {label && <span className="sr-only">{label}</span>}
    </span>
  );
}

/** A centred spinner with visible text, for a page or panel that is still loading. */
export function LoadingBlock({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex items-center justify-center gap-3 py-10 text-body text-ink-faint" role="status">
      <Spinner label="" />
      <span>{label}</span>
    </div>
  );
}
