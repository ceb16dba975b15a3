import { useState, type FormEvent } from 'react';
import { PASSWORD_MIN_LENGTH } from '../../../../server/contracts/auth';
import { PasswordResetConfirmRequest } from '../../../../server/contracts/password-resets';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';

/** Sets the new password from a reset link; other sessions of the account end. */
export function ResetPasswordForm({ token, email, onDone }: { token: string; email: string; onDone: () => void }) {
  const confirm = useConfirmPasswordReset();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const password = formText(data, 'password');
    setFormError(null);
    if (password !== formText(data, 'repeat')) {
      setFieldErrors({ repeat: 'the two passwords differ' });
      return;
    }
    const checked = validateWith(PasswordResetConfirmRequest, { token, password });
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    confirm.mutate(checked.data, {
      onSuccess: onDone,
      onError: (error) => {
        const e = errorsFromFailure(error, ['password']);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5" aria-label="Choose a new password">
      <TextField label="Account" name="email" type="email" value={email} readOnly autoComplete="username" />
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN_LENGTH}
        error={fieldErrors.password}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. Every other session of the account is signed out.`}
      />
      <TextField label="New password again" name="repeat" type="password" autoComplete="new-password" required error={fieldErrors.repeat} />
      <FormAlert message={formError} />
      <Button type="submit" busy={confirm.isPending} busyLabel="Saving…" className="w-full">
        Save the new password
      </Button>
    </form>
  );
}
