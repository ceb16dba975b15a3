import type { FormEvent } from 'react';
import { AuditAction } from '../../../../server/contracts/audit';
import type { Member } from '../../../../server/contracts/benches';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { ACTION_LABELS } from './audit-labels';

export interface AuditFilterValues {
  action: string;
  actorId: string;
  /** local calendar dates "YYYY-MM-DD" ("" = open) */
  fromDate: string;
  toDate: string;
}

export const NO_FILTERS: AuditFilterValues = { action: '', actorId: '', fromDate: '', toDate: '' };

/** Action, person and date range; applied on submit. */
export function AuditFilters({ members, value, onApply }: { members: Member[]; value: AuditFilterValues; onApply: (v: AuditFilterValues) => void }) {
  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const get = (k: string) => String(data.get(k) ?? '');
    onApply({ action: get('action'), actorId: get('actorId'), fromDate: get('fromDate'), toDate: get('toDate') });
  }
  return (
    <form onSubmit={onSubmit} aria-label="Filter the audit trail" className="grid grid-cols-[1fr_1fr_10rem_10rem_auto] items-end gap-x-5">
      <SelectField
        label="Action"
        name="action"
        defaultValue={value.action}
        options={[{ value: '', label: 'every action' }, ...AuditAction.options.map((a) => ({ value: a, label: ACTION_LABELS[a] }))]}
      />
      <SelectField
        label="Person"
        name="actorId"
        defaultValue={value.actorId}
        options={[{ value: '', label: 'anyone' }, ...members.map((m) => ({ value: m.userId, label: `${m.name} (${m.email})` }))]}
      />
      <TextField label="From" name="fromDate" type="date" defaultValue={value.fromDate} />
      <TextField label="To (inclusive)" name="toDate" type="date" defaultValue={value.toDate} />
      <Button type="submit" variant="secondary">
        Apply
      </Button>
    </form>
  );
}
