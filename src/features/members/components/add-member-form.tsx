import { useRef, useState, type FormEvent } from 'react';
import { AddMemberRequest, BenchRole } from '../../../../server/contracts/benches';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { DoneNote, FormAlert } from '../../../components/ui/notes';
import { ROLE_DESCRIPTIONS } from '../../../components/ui/role-tag';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useAddMember } from '../api/add-member';

const FIELDS = ['email', 'role'] as const;

/** The owner adds an existing account to the bench by its e-mail, with a role. */
export function AddMemberForm({ benchId, onChanged }: { benchId: string; onChanged?: () => void }) {
  const addMember = useAddMember(benchId, { onChanged });
  const formRef = useRef<HTMLFormElement>(null);
  const [role, setRole] = useState<BenchRole>('analyst');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = validateWith(AddMemberRequest, { email: formText(data, 'email'), role: formText(data, 'role') });
    setFormError(null);
    setDone(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    addMember.mutate(checked.data, {
      onSuccess: ({ member }) => {
        formRef.current?.reset();
        setRole('analyst');
        setDone(`${member.name} joined as ${member.role}.`);
      },
      onError: (error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  return (
    <form
      ref={formRef}
      noValidate
      onSubmit={onSubmit}
      className="grid grid-cols-2 gap-x-6 gap-y-5"
      aria-label="Add a member"
    >
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="off"
        required
        error={fieldErrors.email}
        hint="They need a Phaseloom account already."
      />
      <SelectField
        label="Role"
        name="role"
        value={role}
        onChange={(e) => setRole(BenchRole.parse(e.target.value))}
        options={BenchRole.options.map((r) => ({ value: r, label: r }))}
        error={fieldErrors.role}
        hint={ROLE_DESCRIPTIONS[role]}
      />
      <FormAlert message={formError} className="col-span-2" />
      <div className="col-span-2 flex items-center gap-4">
        <Button type="submit" busy={addMember.isPending} busyLabel="Adding…">
          Add member
        </Button>
        <DoneNote message={done} />
      </div>
    </form>
  );
}
