/** /reset-password/:token — the link in a password-reset e-mail: choose a new password. */
import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { EntryChrome } from '../../components/layout/site-chrome';
import { ErrorNote, LoadingNote } from '../../components/ui/notes';
import { paths } from '../../config/paths';
import { usePasswordResetCheck } from '../../features/password-reset/api/check-password-reset';
import { ResetPasswordForm } from '../../features/password-reset/components/reset-password-form';
import { isApiError } from '../../lib/api-client';
import { EntryAside } from './entry-aside';

export function ResetPasswordRoute() {
  const token = useParams().token ?? '';
  const check = usePasswordResetCheck(token);
  const [done, setDone] = useState(false);

  let body;
  if (done) {
    body = (
      <p role="status" className="text-sm leading-relaxed text-ink-soft">
        Your new password is saved and every other session of the account is signed out.{' '}
        <Link to={paths.auth.signIn.getHref()} className="font-medium text-accent underline-offset-4 hover:underline">
          Sign in
        </Link>
      </p>
    );
  } else if (check.isPending) {
    body = <LoadingNote>Checking the link…</LoadingNote>;
  } else if (check.isError) {
    const e = check.error;
    const gone = isApiError(e) && e.status === 410;
    body = (
      <ErrorNote title={gone ? 'This link can no longer be used' : 'This link is not valid'} message={e.message}>
        <Link to={paths.auth.forgotPassword.getHref()} className="text-sm font-medium text-accent underline-offset-4 hover:underline">
          Ask for a new link
        </Link>
      </ErrorNote>
    );
  } else {
    body = <ResetPasswordForm token={token} email={check.data.email} onDone={() => setDone(true)} />;
  }

  return (
    <EntryChrome aside={<EntryAside />}>
      <title>Choose a new password · Phaseloom</title>
      <h1 className="mb-7 text-2xl font-semibold tracking-tight">Choose a new password</h1>
      {body}
    </EntryChrome>
  );
}
