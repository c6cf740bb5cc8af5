import { cx } from './cx';

export interface ProgressBarProps {
  /** 0..1; null while the total is not known yet (indeterminate). */
  value: number | null;
  label: string;
  /** Text at the right, e.g. "frame 120 of 480"; defaults to the percentage. */
  detail?: string;
  tone?: 'signal' | 'fit';
  className?: string;
}

export function ProgressBar({ value, label, detail, tone = 'signal', className }: ProgressBarProps) {
  const clamped = value === null ? null : Math.min(1, Math.max(0, value));
  const percent = clamped === null ? null : Math.round(clamped * 100);
  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <div className="flex justify-between gap-4 text-micro text-ink-soft">
        <span>{label}</span>
        <span className="tabular-nums">{detail ?? (percent === null ? 'working…' : `${percent}%`)}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        aria-valuetext={detail}
        className="h-2 overflow-hidden rounded-full bg-paper-sunk"
      >
        <div
          className={cx('h-full rounded-full transition-[width]', tone === 'fit' ? 'bg-fit' : 'bg-signal', percent === null && 'w-1/3 animate-pulse')}
          style={percent === null ? undefined : { width: `${percent}%` }}
        />
      </div>
    </div>
  );
}
