import type { ReactNode } from 'react';
import { cn } from './cn';

export interface SectionProps {
  title: ReactNode;
  /** a short line under the title */
  lede?: ReactNode;
  /** right side of the heading line (a count, a button) */
  aside?: ReactNode;
  id?: string;
  className?: string;
  children: ReactNode;
}

/** A notebook section: a heading on a thin rule, then its content. */
export function Section({ title, lede, aside, id, className, children }: SectionProps) {
  const headingId = id ? `${id}-heading` : undefined;
  return (
    <section aria-labelledby={headingId} className={cn('min-w-0', className)}>
      <div className="flex items-end justify-between gap-4 border-b border-rule pb-2.5">
        <div className="min-w-0">
          <h2 id={headingId} className="text-lg font-semibold tracking-tight text-ink">
            {title}
          </h2>
          {lede && <p className="mt-0.5 text-sm text-ink-faint">{lede}</p>}
        </div>
        {aside && <div className="shrink-0">{aside}</div>}
      </div>
      <div className="pt-5">{children}</div>
    </section>
  );
}

/** A quieter side panel, for forms beside a list. */
export function Panel({ title, children, className, id }: { title: ReactNode; children: ReactNode; className?: string; id?: string }) {
  const headingId = id ? `${id}-heading` : undefined;
  return (
    <section aria-labelledby={headingId} className={cn('rounded-[4px] border border-rule bg-paper-card px-6 pt-5 pb-6', className)}>
      <h2 id={headingId} className="text-base font-semibold tracking-tight text-ink">
        {title}
      </h2>
      <div className="mt-4">{children}</div>
    </section>
  );
}
