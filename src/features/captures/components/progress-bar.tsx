/** A thin ruled progress bar with its label and figure; `value` null draws an indeterminate bar. */
import type { ReactNode } from 'react';
import { cn } from '../../../components/ui/cn';

export interface ProgressBarProps {
  label: ReactNode;
  /** 0..1, or null while the amount is unknown */
  value: number | null;
  /** the figure at the right, e.g. "42 %" or "12.4 MB of 48.0 MB" */
  figure?: ReactNode;
  tone?: 'accent' | 'ok' | 'danger';
  testId?: string;
}

export function ProgressBar({ label, value, figure, tone = 'accent', testId }: ProgressBarProps) {
  const pct = value === null ? null : Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div data-testid={testId}>
      <div className="flex items-baseline justify-between gap-4 text-sm">
        <span className="text-ink">{label}</span>
        {figure !== undefined && <span className="font-mono text-xs text-ink-soft tabular-nums">{figure}</span>}
      </div>
      <div
        role="progressbar"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct ?? undefined}
        aria-label={typeof label === 'string' ? label : undefined}
        className="mt-1.5 h-[3px] w-full overflow-hidden bg-rule"
      >
        {pct === null ? (
          <span className="loading-rule block !h-full !w-full" />
        ) : (
          <div
            className={cn('h-full transition-[width] duration-300', tone === 'ok' ? 'bg-ok' : tone === 'danger' ? 'bg-danger' : 'bg-accent')}
            style={{ width: `${pct}%` }}
          />
        )}
      </div>
    </div>
  );
}
