import type { ReactNode } from 'react';

export interface EmptyStateProps {
  title: ReactNode;
  /** What the person can do about it. */
  children?: ReactNode;
  action?: ReactNode;
}

export function EmptyState({ title, children, action }: EmptyStateProps) {
  return (
    <div className="flex flex-col items-center gap-2 rounded-card border border-dashed border-line bg-paper px-6 py-10 text-center">
      {/* a flat arc: the product's mark, drawn quietly */}
      <svg aria-hidden viewBox="0 0 48 20" className="h-5 w-12 text-ink-faint/60">
        <path d="M2 18 Q22 -6 46 14" fill="none" stroke="currentColor" strokeWidth="2" strokeDasharray="3 3" strokeLinecap="round" />
      </svg>
      <p className="text-lead font-medium text-ink">{title}</p>
      {children && <div className="max-w-md text-body text-ink-soft">{children}</div>}
      {action && <div className="mt-2">{action}</div>}
    </div>
  );
}
