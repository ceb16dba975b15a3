import { useState, type FormEvent } from 'react';
import { SignInRequest, type User } from '../../../../server/contracts/auth';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useSignIn } from '../api/sign-in';

const FIELDS = ['email', 'password'] as const;

export function SignInForm({ onSignedIn }: { onSignedIn: (user: User) => void }) {
  const signIn = useSignIn();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = validateWith(SignInRequest, { email: formText(data, 'email'), password: formText(data, 'password') });
    setFormError(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    signIn.mutate(checked.data, {
      onSuccess: ({ user }) => onSignedIn(user),
      onError: (error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5" aria-label="Sign in">
      <TextField label="E-mail" name="email" type="email" autoComplete="email" required error={fieldErrors.email} />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        required
        error={fieldErrors.password}
      />
      <FormAlert message={formError} />
      <div className="pt-1">
        <Button type="submit" busy={signIn.isPending} busyLabel="Signing in…" className="w-full">
          Sign in
        </Button>
      </div>
    </form>
  );
}
