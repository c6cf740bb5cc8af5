import { useId, type ComponentProps, type ReactNode } from 'react';
import { cx } from './cx';

export interface CardProps extends Omit<ComponentProps<'section'>, 'title'> {
  title?: ReactNode;
  /** One line under the title. */
  subtitle?: ReactNode;
  /** Buttons or links at the right of the heading. */
  actions?: ReactNode;
  /** Drop the inner padding, e.g. for a table that runs edge to edge. */
  flush?: boolean;
}

export function Card({ title, subtitle, actions, flush = false, className, children, ...rest }: CardProps) {
  const titleId = useId();
  return (
    // A titled card is a named region, so screen readers can jump between cards.
    <section aria-labelledby={title ? titleId : undefined} className={cx('rounded-card border border-line bg-paper-raised shadow-[0_1px_0_rgb(27_36_51/0.04)]', className)} {...rest}>
      {(title || actions) && (
        <header className="flex items-start justify-between gap-4 border-b border-line px-4 py-3">
          <div className="min-w-0">
            {title && (
              <h2 id={titleId} className="text-lead font-semibold text-ink">
                {title}
              </h2>
            )}
            {subtitle && <p className="text-micro text-ink-faint">{subtitle}</p>}
          </div>
          {actions && <div className="flex shrink-0 items-center gap-2">{actions}</div>}
        </header>
      )}
      <div className={flush ? undefined : 'p-4'}>{children}</div>
    </section>
  );
}
