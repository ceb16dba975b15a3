import { useRef, useState, type FormEvent } from 'react';
import { BenchRole } from '../../../../server/contracts/benches';
import { CreateInvitationRequest } from '../../../../server/contracts/invitations';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { DoneNote, FormAlert } from '../../../components/ui/notes';
import { ROLE_DESCRIPTIONS } from '../../../components/ui/role-tag';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useCreateInvitation } from '../api/create-invitation';

const FIELDS = ['email', 'role'] as const;

/** The owner invites an address by e-mail with a role; the link works once, for 7 days. */
export function InviteForm({ benchId }: { benchId: string }) {
  const create = useCreateInvitation(benchId);
  const formRef = useRef<HTMLFormElement>(null);
  const [role, setRole] = useState<BenchRole>('analyst');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = validateWith(CreateInvitationRequest, { email: formText(data, 'email'), role: formText(data, 'role') });
    setFormError(null);
    setDone(null);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    create.mutate(checked.data, {
      onSuccess: ({ invitation, emailSent }) => {
        formRef.current?.reset();
        setRole('analyst');
        if (emailSent) setDone(`Invitation sent to ${invitation.email}.`);
        else setFormError(`The invitation for ${invitation.email} was saved, but the mail server refused the e-mail. Try again later.`);
      },
      onError: (error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} className="grid grid-cols-2 gap-x-6 gap-y-5" aria-label="Invite by e-mail">
      <TextField
        label="Invitee e-mail"
        name="email"
        type="email"
        autoComplete="off"
        required
        error={fieldErrors.email}
        hint="No account needed: the link lets them create one. It works once, for 7 days."
      />
      <SelectField
        label="Invitee role"
        name="role"
        value={role}
        onChange={(e) => setRole(BenchRole.parse(e.target.value))}
        options={BenchRole.options.map((r) => ({ value: r, label: r }))}
        error={fieldErrors.role}
        hint={ROLE_DESCRIPTIONS[role]}
      />
      <FormAlert message={formError} className="col-span-2" />
      <div className="col-span-2 flex items-center gap-4">
        <Button type="submit" busy={create.isPending} busyLabel="Sending…">
          Send invitation
        </Button>
        <DoneNote message={done} />
      </div>
    </form>
  );
}
