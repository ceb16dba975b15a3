import { useState, type FormEvent } from 'react';
import { PasswordResetRequest } from '../../../../server/contracts/password-resets';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useRequestPasswordReset } from '../api/request-password-reset';

/** Asks for a password-reset link; the answer is the same whether or not the address has an account. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const checked = validateWith(PasswordResetRequest, { email: formText(new FormData(event.currentTarget), 'email') });
    setFormError(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    request.mutate(checked.data, {
      onSuccess: ({ message }) => setSent(message),
      onError: (error) => {
        const e = errorsFromFailure(error, ['email']);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  if (sent) {
    return (
      <p role="status" className="text-sm leading-relaxed text-ink-soft">
        {sent.charAt(0).toUpperCase() + sent.slice(1)}.
      </p>
    );
  }
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5" aria-label="Ask for a password-reset link">
      <TextField label="E-mail" name="email" type="email" autoComplete="email" required error={fieldErrors.email} />
      <FormAlert message={formError} />
      <Button type="submit" busy={request.isPending} busyLabel="Sending…" className="w-full">
        Send the link
      </Button>
    </form>
  );
}
