import { useRef, useState, type FormEvent } from 'react';
import { CreateBenchRequest, type Bench } from '../../../../server/contracts/benches';
import { Button } from '../../../components/ui/button';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useCreateBench } from '../api/create-bench';

const FIELDS = ['name', 'description'] as const;

export function CreateBenchForm({ onCreated }: { onCreated: (bench: Bench) => void }) {
  const createBench = useCreateBench();
  const formRef = useRef<HTMLFormElement>(null);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = validateWith(CreateBenchRequest, {
      name: formText(data, 'name'),
      description: formText(data, 'description'),
    });
    setFormError(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    // send what the person typed; the server applies the same schema
    const body = { name: formText(data, 'name').trim(), description: formText(data, 'description').trim() || undefined };
    createBench.mutate(body, {
      onSuccess: ({ bench }) => {
        formRef.current?.reset();
        onCreated(bench);
      },
      onError: (error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} className="flex flex-col gap-5" aria-label="Start a bench">
      <TextField label="Name" name="name" required error={fieldErrors.name} placeholder="e.g. Narrow-linewidth bench" />
      <TextAreaField
        label="Description"
        name="description"
        aside="optional"
        rows={3}
        error={fieldErrors.description}
        hint="What is measured here, and with which reference."
      />
      <FormAlert message={formError} />
      <div>
        <Button type="submit" busy={createBench.isPending} busyLabel="Starting…">
          Start bench
        </Button>
      </div>
    </form>
  );
}
