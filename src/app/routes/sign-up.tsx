import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { EntryChrome } from '../../components/layout/site-chrome';
import { paths, safeRedirectTarget } from '../../config/paths';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { EntryAside } from './entry-aside';
import { requireGuest } from './guards';

export const signUpLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    requireGuest(queryClient, request);

export function SignUpRoute() {
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const redirectTo = search.get('redirectTo');
  return (
    <EntryChrome aside={<EntryAside />}>
      <title>Create an account · Phaseloom</title>
      <h1 className="text-2xl font-semibold tracking-tight">Create an account</h1>
      <p className="mt-1.5 mb-7 text-sm text-ink-soft">Then start a bench, or ask an owner to add you to theirs.</p>
      <SignUpForm onSignedUp={() => navigate(safeRedirectTarget(redirectTo), { replace: true })} />
      <p className="mt-8 border-t border-rule pt-5 text-sm text-ink-soft">
        Already have an account?{' '}
        <Link to={paths.auth.signIn.getHref(redirectTo)} className="font-medium text-accent underline-offset-4 hover:underline">
          Sign in
        </Link>
      </p>
    </EntryChrome>
  );
}
