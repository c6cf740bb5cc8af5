import type { ReactNode } from 'react';
import { cx } from './cx';

export interface SafetyNoteProps {
  children: ReactNode;
  /** Defaults to "Safety"; keep it plain. */
  heading?: string;
  className?: string;
}

/** Cautions for work that can hurt someone. Deliberately has no collapse or dismiss control. */
export function SafetyNote({ children, heading = 'Safety', className }: SafetyNoteProps) {
  return (
    <aside aria-label={heading} className={cx('rounded-card border-2 border-alert bg-paper-raised px-4 py-3', className)}>
      <h2 className="mb-1 flex items-center gap-2 text-body font-semibold text-alert">
        <svg aria-hidden viewBox="0 0 16 16" className="size-4">
          <path d="M8 1.5 15 14.5H1z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
          <path d="M8 6v4M8 11.8v.4" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
        </svg>
        {heading}
      </h2>
      <div className="space-y-1 text-body text-ink">{children}</div>
    </aside>
  );
}
