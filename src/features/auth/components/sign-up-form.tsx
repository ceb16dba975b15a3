import { useState, type FormEvent } from 'react';
import { PASSWORD_MIN_LENGTH, SignUpRequest, type User } from '../../../../server/contracts/auth';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useSignUp } from '../api/sign-up';

const FIELDS = ['name', 'email', 'password'] as const;

export function SignUpForm({ onSignedUp }: { onSignedUp: (user: User) => void }) {
  const signUp = useSignUp();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = validateWith(SignUpRequest, {
      name: formText(data, 'name'),
      email: formText(data, 'email'),
      password: formText(data, 'password'),
    });
    setFormError(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    signUp.mutate(checked.data, {
      onSuccess: ({ user }) => onSignedUp(user),
      onError: (error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5" aria-label="Create an account">
      <TextField label="Name" name="name" autoComplete="name" required error={fieldErrors.name} hint="As colleagues on a bench will see it." />
      <TextField label="E-mail" name="email" type="email" autoComplete="email" required error={fieldErrors.email} />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN_LENGTH}
        error={fieldErrors.password}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words work well.`}
      />
      <FormAlert message={formError} />
      <div className="pt-1">
        <Button type="submit" busy={signUp.isPending} busyLabel="Creating the account…" className="w-full">
          Create account
        </Button>
      </div>
    </form>
  );
}
