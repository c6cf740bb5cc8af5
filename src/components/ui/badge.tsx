import type { ReactNode } from 'react';
import { cx } from './cx';

/** signal: a person's action or pending work; fit: model output or approved; alert: rejected or unsafe; ok: done and fine. */
export type BadgeTone = 'neutral' | 'signal' | 'fit' | 'alert' | 'ok';

const TONES: Record<BadgeTone, string> = {
  neutral: 'bg-paper-sunk text-ink-soft border-line',
  signal: 'bg-signal-light text-signal-dark border-signal/40',
  fit: 'bg-fit-light text-fit-dark border-fit/30',
  alert: 'bg-alert-light text-alert border-alert/30',
  ok: 'bg-ok-light text-ok border-ok/30',
};

export interface BadgeProps {
  tone?: BadgeTone;
  children: ReactNode;
  className?: string;
  title?: string;
}

export function Badge({ tone = 'neutral', children, className, title }: BadgeProps) {
  return (
    <span title={title} className={cx('inline-flex items-center gap-1 rounded-full border px-2 py-px text-micro font-medium whitespace-nowrap', TONES[tone], className)}>
      {children}
    </span>
  );
}
