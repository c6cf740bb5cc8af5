import type { ReactNode } from 'react';
import { cx } from './cx';

export interface KeyValueItem {
  label: ReactNode;
  value: ReactNode;
  /** Numbers read best right-aligned in tabular figures. */
  numeric?: boolean;
}

export interface KeyValueListProps {
  items: readonly KeyValueItem[];
  /** 'rows' puts label and value side by side; 'stacked' puts the label above. */
  layout?: 'rows' | 'stacked';
  className?: string;
}

export function KeyValueList({ items, layout = 'rows', className }: KeyValueListProps) {
  if (layout === 'stacked') {
    return (
      <dl className={cx('grid grid-cols-[repeat(auto-fill,minmax(10rem,1fr))] gap-x-6 gap-y-3', className)}>
        {items.map((item, i) => (
          <div key={i} className="min-w-0">
            <dt className="text-micro uppercase tracking-wide text-ink-faint">{item.label}</dt>
            <dd className={cx('text-body text-ink', item.numeric && 'tabular-nums')}>{item.value}</dd>
          </div>
        ))}
      </dl>
    );
  }
  return (
    <dl className={cx('divide-y divide-line', className)}>
      {items.map((item, i) => (
        <div key={i} className="flex items-baseline justify-between gap-4 py-1.5">
          <dt className="text-body text-ink-soft">{item.label}</dt>
          <dd className={cx('text-right text-body text-ink', item.numeric && 'tabular-nums')}>{item.value}</dd>
        </div>
      ))}
    </dl>
  );
}
