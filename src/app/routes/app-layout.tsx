/** The signed-in frame: header with the main sections, the page, and the footer. */
import type { QueryClient } from '@tanstack/react-query';
import { Suspense, useEffect, useRef } from 'react';
import { Link, Outlet, useLocation, useMatches, type LoaderFunctionArgs } from 'react-router';
import { SiteChrome } from '../../components/layout/site-chrome';
import { LoadingNote } from '../../components/ui/notes';
import { paths } from '../../config/paths';
import { useSignedInUser } from '../../features/auth/api/get-me';
import { requireUser } from './guards';

export interface RouteHandle {
  /** show the laser-safety caution in the footer (pages about setups and captures) */
  laserSafety?: boolean;
}

export const appLayoutLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

/** After a navigation, focus moves to the page so keyboard and screen-reader users start there. */
function useFocusMainOnNavigate() {
  const location = useLocation();
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    document.getElementById('main')?.focus({ preventScroll: true });
  }, [location.pathname]);
}

export function AppLayout() {
  const user = useSignedInUser();
  const matches = useMatches();
  const laserSafety = matches.some((m) => (m.handle as RouteHandle | undefined)?.laserSafety);
  useFocusMainOnNavigate();
  return (
    <SiteChrome
      homeHref={paths.benches.list.getHref()}
      nav={[
        { to: paths.benches.list.getHref(), label: 'Benches' },
        { to: paths.account.getHref(), label: 'Account' },
      ]}
      account={
        <Link to={paths.account.getHref()} className="flex items-center gap-2.5 rounded-[3px] hover:text-ink">
          <span
            aria-hidden="true"
            className="flex h-7 w-7 items-center justify-center rounded-full border border-rule-strong bg-paper-card text-xs font-semibold text-ink-soft"
          >
            {initials(user.name)}
          </span>
          <span>{user.name}</span>
        </Link>
      }
      showLaserSafety={laserSafety}
    >
      {/* loaders fill the cache first; this only shows if a page asks for data they did not load */}
      <Suspense fallback={<LoadingNote>Loading the page…</LoadingNote>}>
        <Outlet />
      </Suspense>
    </SiteChrome>
  );
}

function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  const letters = parts.length > 1 ? [parts[0], parts[parts.length - 1]] : parts;
  return letters.map((p) => p.charAt(0).toUpperCase()).join('') || '·';
}
