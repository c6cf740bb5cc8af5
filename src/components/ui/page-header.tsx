import type { ReactNode } from 'react';

export interface PageHeaderProps {
  title: ReactNode;
  subtitle?: ReactNode;
  /** A small line above the title, e.g. the team or the series a page belongs to. */
  eyebrow?: ReactNode;
  actions?: ReactNode;
}

/** The one h1 of a page. */
export function PageHeader({ title, subtitle, eyebrow, actions }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-line pb-4">
      <div className="min-w-0">
        {eyebrow && <p className="mb-1 text-micro font-medium uppercase tracking-wider text-ink-faint">{eyebrow}</p>}
        <h1 className="text-title text-ink">{title}</h1>
        {subtitle && <p className="mt-1 max-w-3xl text-body text-ink-soft">{subtitle}</p>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </header>
  );
}
