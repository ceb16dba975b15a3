import type { ReactNode } from 'react';
import type { User } from '../../../../server/contracts/auth';
import { Mono } from '../../../components/ui/quantity';
import { formatIsoDate, formatIsoDateTime } from '../../../lib/dates';

/** The signed-in person's record, as a short definition list. */
export function AccountDetails({ user }: { user: User }) {
  const rows: Array<[string, ReactNode]> = [
    ['Name', user.name],
    ['E-mail', <Mono key="e">{user.email}</Mono>],
    ['Account since', <Mono key="d" title={formatIsoDateTime(user.createdAt)}>{formatIsoDate(user.createdAt)}</Mono>],
  ];
  return (
    <dl className="-mt-1 divide-y divide-rule border-b border-rule">
      {rows.map(([term, value]) => (
        <div key={term} className="grid grid-cols-[11rem_minmax(0,1fr)] items-baseline gap-6 py-3.5">
          <dt className="text-sm text-ink-faint">{term}</dt>
          <dd className="text-ink">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
