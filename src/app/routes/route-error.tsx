/**
 * The error boundary of every route: says what went wrong and what to do, with a retry that
 * clears failed queries and runs the page's loader again.
 */
import { useQueryClient } from '@tanstack/react-query';
import { Link, isRouteErrorResponse, useLocation, useRevalidator, useRouteError } from 'react-router';
import { ErrorNote } from '../../components/ui/notes';
import { buttonClasses } from '../../components/ui/button';
import { paths } from '../../config/paths';
import { isApiError } from '../../lib/api-client';

interface Explained {
  title: string;
  message: string;
  retry: boolean;
  signIn?: boolean;
}

function explain(error: unknown): Explained {
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) {
      return { title: 'Nothing here', message: 'This address does not lead to a page. Check it, or go back to your benches.', retry: false };
    }
    return { title: `The page answered ${error.status}`, message: String(error.statusText || 'Try again.'), retry: true };
  }
  if (isApiError(error)) {
    if (error.status === 401) {
      return { title: 'You are signed out', message: 'Your session has ended. Sign in again to continue where you were.', retry: false, signIn: true };
    }
    if (error.status === 404) {
      return {
        title: 'Not found on your benches',
        message: 'This bench or record does not exist, or you are not a member of its bench. Ask a bench owner to add you.',
        retry: false,
      };
    }
    if (error.status === 403) {
      return { title: 'Not allowed for your role', message: error.message, retry: false };
    }
    if (error.status === 0) {
      return { title: 'No connection to the server', message: error.message, retry: true };
    }
    return { title: 'This could not be loaded', message: error.message, retry: true };
  }
  return {
    title: 'Something broke on this page',
    message: 'The page ran into an error of its own. Try again; if it keeps happening, reload the browser tab.',
    retry: true,
  };
}

export function RouteError() {
  const error = useRouteError();
  const revalidator = useRevalidator();
  const queryClient = useQueryClient();
  const location = useLocation();
  const e = explain(error);

  async function retry() {
    await queryClient.resetQueries({ predicate: (q) => q.state.status === 'error' });
    await revalidator.revalidate();
  }

  return (
    <div className="max-w-[44rem] py-6">
      <ErrorNote title={e.title} message={e.message} onRetry={e.retry ? () => void retry() : undefined}>
        {e.signIn ? (
          <Link to={paths.auth.signIn.getHref(location.pathname + location.search)} className={buttonClasses('primary', 'sm')}>
            Sign in
          </Link>
        ) : (
          <Link to={paths.benches.list.getHref()} className="text-sm text-accent underline-offset-4 hover:underline">
            Back to your benches
          </Link>
        )}
      </ErrorNote>
    </div>
  );
}

/** The last resort, when even the page frame failed: no frame, just the note. */
export function RootError() {
  return (
    <main id="main" className="mx-auto max-w-[44rem] px-10 pt-24">
      <RouteError />
    </main>
  );
}
