import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { EntryChrome } from '../../components/layout/site-chrome';
import { paths, safeRedirectTarget } from '../../config/paths';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { EntryAside } from './entry-aside';
import { requireGuest } from './guards';

export const signInLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    requireGuest(queryClient, request);

export function SignInRoute() {
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const redirectTo = search.get('redirectTo');
  return (
    <EntryChrome aside={<EntryAside />}>
      <title>Sign in · Phaseloom</title>
      <h1 className="text-2xl font-semibold tracking-tight">Sign in</h1>
      <p className="mt-1.5 mb-7 text-sm text-ink-soft">
        {redirectTo ? 'Sign in to open the page you asked for.' : 'Welcome back to the bench.'}
      </p>
      <SignInForm onSignedIn={() => navigate(safeRedirectTarget(redirectTo), { replace: true })} />
      <p className="mt-4 text-sm">
        <Link to={paths.auth.forgotPassword.getHref()} className="text-ink-soft underline-offset-4 hover:text-accent hover:underline">
          Forgot password?
        </Link>
      </p>
      <p className="mt-8 border-t border-rule pt-5 text-sm text-ink-soft">
        New here?{' '}
        <Link to={paths.auth.signUp.getHref(redirectTo)} className="font-medium text-accent underline-offset-4 hover:underline">
          Create an account
        </Link>
      </p>
    </EntryChrome>
  );
}
