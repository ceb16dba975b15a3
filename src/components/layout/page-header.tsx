import type { ReactNode } from 'react';
import { Link } from 'react-router';

export interface Crumb {
  label: string;
  to?: string;
}

export interface PageHeaderProps {
  /** where this page sits: Benches / Larchmere narrow-linewidth bench */
  trail?: Crumb[];
  title: ReactNode;
  /** a line under the title */
  lede?: ReactNode;
  /** facts shown under the lede (role, counts, dates) */
  meta?: ReactNode;
  actions?: ReactNode;
}

/** The heading of a notebook page: its trail, title, a lede, and a thin rule below. */
export function PageHeader({ trail, title, lede, meta, actions }: PageHeaderProps) {
  return (
    <header className="border-b border-rule pb-7">
      {trail && trail.length > 0 && (
        <nav aria-label="You are here" className="mb-3">
          <ol className="flex flex-wrap items-center gap-x-2 text-xs font-medium tracking-[0.08em] text-ink-faint uppercase">
            {trail.map((c, i) => (
              <li key={`${c.label}-${i}`} className="flex items-center gap-2">
                {i > 0 && <span aria-hidden="true">/</span>}
                {c.to ? (
                  <Link to={c.to} className="hover:text-ink hover:underline underline-offset-4">
                    {c.label}
                  </Link>
                ) : (
                  <span aria-current="page">{c.label}</span>
                )}
              </li>
            ))}
          </ol>
        </nav>
      )}
      <div className="flex items-start justify-between gap-8">
        <div className="min-w-0">
          <h1 className="text-[2rem] leading-tight font-semibold tracking-tight text-ink text-balance">{title}</h1>
          {lede && <div className="mt-2 max-w-[44rem] text-[0.9375rem] leading-relaxed text-ink-soft">{lede}</div>}
          {meta && <div className="mt-4 flex flex-wrap items-center gap-x-6 gap-y-2 text-sm text-ink-soft">{meta}</div>}
        </div>
        {actions && <div className="flex shrink-0 items-center gap-3 pt-1">{actions}</div>}
      </div>
    </header>
  );
}
