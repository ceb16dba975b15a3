/**
 * The frame of every signed-in page: skip link, header with the wordmark and the main sections,
 * the page itself in <main id="main">, and a quiet footer (with the laser-safety caution on pages
 * that ask for it).
 */
import type { ReactNode } from 'react';
import { Link, NavLink } from 'react-router';
import { cn } from '../ui/cn';
import { LaserSafetyNote } from './laser-safety-note';
import { NavigationProgress } from './navigation-progress';
import { SkipLink } from './skip-link';
import { Wordmark } from './wordmark';

export interface NavItem {
  to: string;
  label: string;
}

export interface SiteChromeProps {
  homeHref: string;
  nav: NavItem[];
  /** shown at the right of the header, e.g. the signed-in person */
  account?: ReactNode;
  showLaserSafety?: boolean;
  children: ReactNode;
}

export function SiteChrome({ homeHref, nav, account, showLaserSafety, children }: SiteChromeProps) {
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <NavigationProgress />
      <header className="border-b border-rule">
        <div className="mx-auto flex h-16 max-w-page items-center gap-10 px-10">
          <Link to={homeHref} className="rounded-[3px]" aria-label="Phaseloom, your benches">
            <Wordmark />
          </Link>
          <nav aria-label="Main" className="flex h-full items-stretch gap-7">
            {nav.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                className={({ isActive }) =>
                  cn(
                    'relative flex items-center text-[0.9375rem] transition-colors',
                    isActive
                      ? 'font-medium text-ink after:absolute after:inset-x-0 after:-bottom-px after:h-0.5 after:bg-accent'
                      : 'text-ink-soft hover:text-ink',
                  )
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          {account && <div className="ml-auto flex items-center gap-4 text-sm text-ink-soft">{account}</div>}
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-page flex-1 px-10 pt-10 pb-20 outline-none">
        {children}
      </main>
      <footer className="border-t border-rule">
        <div className="mx-auto flex max-w-page flex-col gap-3 px-10 py-6">
          {showLaserSafety && <LaserSafetyNote />}
          <p className="text-xs text-ink-faint">
            Phaseloom — frequency-noise spectra and linewidths, kept with the bench.
          </p>
        </div>
      </footer>
    </div>
  );
}

/** The frame of the sign-in and sign-up pages: one calm column on the paper. */
export function EntryChrome({ children, aside }: { children: ReactNode; aside?: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <NavigationProgress />
      <main id="main" tabIndex={-1} className="flex flex-1 items-start justify-center px-10 pt-[11vh] pb-16 outline-none">
        <div className="grid w-full max-w-[58rem] grid-cols-[minmax(0,1fr)_minmax(0,25rem)] gap-16">
          <div className="pt-8">
            <Wordmark size="lg" />
            {aside}
          </div>
          <div className="rounded-[4px] border border-rule bg-paper-card px-9 pt-8 pb-9 shadow-[0_1px_0_rgb(185_174_151/0.35)]">
            {children}
          </div>
        </div>
      </main>
    </div>
  );
}
