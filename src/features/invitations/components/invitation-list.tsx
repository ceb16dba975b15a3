import { formatIsoDateTime } from '../../../lib/dates';
import { useInvitations } from '../api/get-invitations';

const STATUS_TEXT = { pending: 'waiting', accepted: 'joined', expired: 'expired' } as const;

/** The bench's recent invitations and what became of them (owners). */
export function InvitationList({ benchId }: { benchId: string }) {
  const { data, isPending, isError } = useInvitations(benchId);
  if (isPending || isError || data.invitations.length === 0) return null;
  return (
    <table className="mt-6 w-full text-sm" aria-label="Invitations">
      <thead>
        <tr className="border-b border-rule text-left text-xs text-ink-faint">
          <th className="py-1.5 font-medium">Invited address</th>
          <th className="py-1.5 font-medium">Role</th>
          <th className="py-1.5 font-medium">State</th>
          <th className="py-1.5 font-medium">Link valid until</th>
        </tr>
      </thead>
      <tbody>
        {data.invitations.map((i) => (
          <tr key={i.id} className="border-b border-rule/60">
            <td className="py-1.5">{i.email}</td>
            <td className="py-1.5">{i.role}</td>
            <td className="py-1.5">{STATUS_TEXT[i.status]}</td>
            <td className="py-1.5 tabular-nums">{i.status === 'pending' ? formatIsoDateTime(i.expiresAt) : '—'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
