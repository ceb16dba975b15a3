import { useRef, useState, type FormEvent } from 'react';
import { CreateApiTokenRequest, type CreatedApiTokenResponse } from '../../../../server/contracts/api-tokens';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useCreateApiToken } from '../api/create-api-token';

const FIELDS = ['name', 'expiresAt'] as const;

/** "2027-03-31" (a date input, local time) → the end of that day as an ISO timestamp; '' → undefined. */
function endOfDay(date: string): string | undefined {
  if (!date) return undefined;
  const d = new Date(`${date}T23:59:59.999`);
  return Number.isNaN(d.getTime()) ? date : d.toISOString();
}

/** Names a new token (and optionally its last day); hands the one-time secret to `onCreated`. */
export function CreateApiTokenForm({ onCreated }: { onCreated: (created: CreatedApiTokenResponse) => void }) {
  const create = useCreateApiToken();
  const formRef = useRef<HTMLFormElement>(null);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = validateWith(CreateApiTokenRequest, {
      name: formText(data, 'name'),
      expiresAt: endOfDay(formText(data, 'expiresAt')),
    });
    setFormError(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    create.mutate(checked.data, {
      onSuccess: (created) => {
        formRef.current?.reset();
        onCreated(created);
      },
      onError: (error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} className="grid grid-cols-2 gap-x-6 gap-y-5" aria-label="Make an API token">
      <TextField
        label="What it is for"
        name="name"
        autoComplete="off"
        required
        error={fieldErrors.name}
        hint="e.g. “lab PC upload script”"
      />
      <TextField
        label="Valid until"
        name="expiresAt"
        type="date"
        aside="optional"
        error={fieldErrors.expiresAt}
        hint="Without a date it works until you revoke it."
      />
      <FormAlert message={formError} className="col-span-2" />
      <div className="col-span-2">
        <Button type="submit" busy={create.isPending} busyLabel="Making…">
          Make token
        </Button>
      </div>
    </form>
  );
}
