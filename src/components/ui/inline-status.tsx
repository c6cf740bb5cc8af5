import type { ReactNode } from 'react';
import { cx } from './cx';

export type StatusTone = 'info' | 'ok' | 'alert';

export interface InlineStatusProps {
  tone?: StatusTone;
  children: ReactNode;
  className?: string;
}

const TONES: Record<StatusTone, string> = {
  info: 'border-line bg-paper-sunk text-ink-soft',
  ok: 'border-ok/30 bg-ok-light text-ok',
  alert: 'border-alert/40 bg-alert-light/60 text-alert',
};

/** A one-line result next to what caused it ("Saved.", "Invitation sent."); announced politely. */
export function InlineStatus({ tone = 'info', children, className }: InlineStatusProps) {
  return (
    <p role={tone === 'alert' ? 'alert' : 'status'} className={cx('rounded-md border px-3 py-1.5 text-body', TONES[tone], className)}>
      {children}
    </p>
  );
}
