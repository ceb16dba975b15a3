/** A number with its unit, set in JetBrains Mono with tabular figures: <Quantity q={formatSI(12400, 'Hz')} />. */
import type { ReactNode } from 'react';
import type { FormattedQuantity } from '../../lib/units';
import { cn } from './cn';

export interface QuantityProps {
  q: FormattedQuantity;
  className?: string;
  /** a title (e.g. the exact value or the settings it came from) */
  title?: string;
}

export function Quantity({ q, className, title }: QuantityProps) {
  return (
    <span className={cn('font-mono tabular-nums whitespace-nowrap', className)} title={title}>
      {q.number}
      {q.unit && (
        <>
          {'\u00a0'}
          <span className="text-ink-soft">{q.unit}</span>
        </>
      )}
    </span>
  );
}

/** Any machine-ish value (date, count, id) in JetBrains Mono. */
export function Mono({ children, className, title }: { children: ReactNode; className?: string; title?: string }) {
  return (
    <span className={cn('font-mono tabular-nums', className)} title={title}>
      {children}
    </span>
  );
}
