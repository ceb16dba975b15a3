import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { PASSWORD_MIN_LENGTH, type User } from '../../../../server/contracts/auth';
import { AcceptInvitationRequest, type InvitationPreview } from '../../../../server/contracts/invitations';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { paths } from '../../../config/paths';
import { formatIsoDateTime } from '../../../lib/dates';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useAcceptInvitation } from '../api/accept-invitation';

const FIELDS = ['name', 'password'] as const;

/**
 * What the invitation link offers: create the account (the invited address, prefilled and fixed),
 * join with the signed-in account, or sign in first when the address has an account already.
 */
export function InvitationAcceptance({
  token,
  invitation,
  user,
  onJoined,
}: {
  token: string;
  invitation: InvitationPreview;
  user: User | null;
  onJoined: (benchId: string) => void;
}) {
  const accept = useAcceptInvitation();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const here = paths.invitation.getHref(token);

  const onFailure = (error: unknown) => {
    const e = errorsFromFailure(error, FIELDS);
    setFieldErrors(e.fieldErrors);
    setFormError(e.formError);
  };

  function onCreate(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = validateWith(AcceptInvitationRequest, { token, name: formText(data, 'name'), password: formText(data, 'password') });
    setFormError(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    accept.mutate(checked.data, { onSuccess: ({ benchId }) => onJoined(benchId), onError: onFailure });
  }

  const summary = (
    <p className="mt-1.5 mb-7 text-sm leading-relaxed text-ink-soft">
      {invitation.invitedBy ?? 'An owner'} invites <strong className="font-medium text-ink">{invitation.email}</strong> to the bench{' '}
      <strong className="font-medium text-ink">“{invitation.benchName}”</strong> as {invitation.role}. The link works once, until{' '}
      {formatIsoDateTime(invitation.expiresAt)}.
    </p>
  );

  if (user) {
    if (user.email !== invitation.email) {
      return (
        <>
          {summary}
          <FormAlert message={`You are signed in as ${user.email}. Sign out, then open the link again to accept it as ${invitation.email}.`} />
        </>
      );
    }
    return (
      <>
        {summary}
        <FormAlert message={formError} />
        <Button
          className="w-full"
          busy={accept.isPending}
          busyLabel="Joining…"
          onClick={() => accept.mutate({ token }, { onSuccess: ({ benchId }) => onJoined(benchId), onError: onFailure })}
        >
          Join the bench
        </Button>
      </>
    );
  }

  if (invitation.accountExists) {
    return (
      <>
        {summary}
        <p className="text-sm text-ink-soft">
          {invitation.email} has a Phaseloom account.{' '}
          <Link to={paths.auth.signIn.getHref(here)} className="font-medium text-accent underline-offset-4 hover:underline">
            Sign in to accept
          </Link>
        </p>
      </>
    );
  }

  return (
    <>
      {summary}
      <form noValidate onSubmit={onCreate} className="flex flex-col gap-5" aria-label="Create your account and join">
        <TextField label="E-mail" name="email" type="email" value={invitation.email} readOnly hint="The invited address; the account uses it." />
        <TextField label="Name" name="name" autoComplete="name" required error={fieldErrors.name} hint="As colleagues on the bench will see it." />
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="new-password"
          required
          minLength={PASSWORD_MIN_LENGTH}
          error={fieldErrors.password}
          hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        />
        <FormAlert message={formError} />
        <Button type="submit" busy={accept.isPending} busyLabel="Creating the account…" className="w-full">
          Create account and join
        </Button>
      </form>
    </>
  );
}
