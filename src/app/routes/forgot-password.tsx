/** /forgot-password — ask for a single-use link (one hour) to choose a new password. */
import { Link } from 'react-router';
import { EntryChrome } from '../../components/layout/site-chrome';
import { paths } from '../../config/paths';
import { ForgotPasswordForm } from '../../features/password-reset/components/forgot-password-form';
import { EntryAside } from './entry-aside';

export function ForgotPasswordRoute() {
  return (
    <EntryChrome aside={<EntryAside />}>
      <title>Forgot password · Phaseloom</title>
      <h1 className="text-2xl font-semibold tracking-tight">Forgot your password?</h1>
      <p className="mt-1.5 mb-7 text-sm text-ink-soft">Give the address you sign in with; we e-mail a link to choose a new password.</p>
      <ForgotPasswordForm />
      <p className="mt-8 border-t border-rule pt-5 text-sm text-ink-soft">
        Remembered it?{' '}
        <Link to={paths.auth.signIn.getHref()} className="font-medium text-accent underline-offset-4 hover:underline">
          Sign in
        </Link>
      </p>
    </EntryChrome>
  );
}
