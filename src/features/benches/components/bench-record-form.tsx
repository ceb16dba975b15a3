import { useState, type FormEvent } from 'react';
import { UpdateBenchRequest, type Bench } from '../../../../server/contracts/benches';
import { Button } from '../../../components/ui/button';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { DoneNote, FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useUpdateBench } from '../api/update-bench';

const FIELDS = ['name', 'description'] as const;

/** The owner's form for a bench's name and description. */
export function BenchRecordForm({ bench, onSaved }: { bench: Bench; onSaved?: () => void }) {
  const updateBench = useUpdateBench(bench.id);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const values = { name: formText(data, 'name'), description: formText(data, 'description') };
    const checked = validateWith(UpdateBenchRequest, values);
    setFormError(null);
    setDone(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    updateBench.mutate(
      { name: values.name.trim(), description: values.description.trim() === '' ? null : values.description.trim() },
      {
        onSuccess: () => {
          setDone('Saved.');
          onSaved?.();
        },
        onError: (error) => {
          const e = errorsFromFailure(error, FIELDS);
          setFieldErrors(e.fieldErrors);
          setFormError(e.formError);
        },
      },
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5" aria-label="Bench name and description">
      <TextField label="Name" name="name" required defaultValue={bench.name} error={fieldErrors.name} />
      <TextAreaField
        label="Description"
        name="description"
        aside="optional"
        rows={3}
        defaultValue={bench.description ?? ''}
        error={fieldErrors.description}
      />
      <FormAlert message={formError} />
      <div className="flex items-center gap-4">
        <Button type="submit" variant="secondary" busy={updateBench.isPending} busyLabel="Saving…">
          Save changes
        </Button>
        <DoneNote message={done} />
      </div>
    </form>
  );
}
