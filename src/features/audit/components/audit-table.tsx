import type { AuditEvent } from '../../../../server/contracts/audit';
import { EmptyNote } from '../../../components/ui/notes';
import { formatIsoDateTime } from '../../../lib/dates';
import { ACTION_LABELS } from './audit-labels';

function describeDetails(e: AuditEvent): string {
  const d = e.details ?? {};
  const text = (k: string) => (typeof d[k] === 'string' || typeof d[k] === 'number' || typeof d[k] === 'boolean' ? String(d[k]) : null);
  switch (e.action) {
    case 'capture.uploaded':
    case 'capture.deleted':
      return text('fileName') ?? e.targetId ?? '';
    case 'member.role_changed':
      return `${text('email') ?? ''}: ${text('from') ?? '?'} → ${text('to') ?? '?'}`;
    case 'member.added':
    case 'member.removed':
    case 'invitation.created':
    case 'invitation.accepted':
      return [text('email'), text('role')].filter(Boolean).join(' as ');
    default:
      return e.targetId ? `${e.targetType ?? ''} ${e.targetId}`.trim() : '';
  }
}

/** Who did what, when — newest first. */
export function AuditTable({ events }: { events: AuditEvent[] }) {
  if (events.length === 0) return <EmptyNote title="Nothing recorded matches these filters" />;
  return (
    <table className="w-full text-sm" aria-label="Audit trail">
      <thead>
        <tr className="border-b border-rule-strong text-left text-xs text-ink-faint">
          <th className="py-2 pr-4 font-medium">When</th>
          <th className="py-2 pr-4 font-medium">Who</th>
          <th className="py-2 pr-4 font-medium">What</th>
          <th className="py-2 font-medium">About</th>
        </tr>
      </thead>
      <tbody>
        {events.map((e) => (
          <tr key={e.id} className="border-b border-rule/70 align-top">
            <td className="py-2 pr-4 whitespace-nowrap tabular-nums">
              <time dateTime={e.at} title={e.at}>
                {formatIsoDateTime(e.at)}
              </time>
            </td>
            <td className="py-2 pr-4">{e.actor.name ?? e.actor.email ?? 'a deleted account'}</td>
            <td className="py-2 pr-4">{ACTION_LABELS[e.action]}</td>
            <td className="py-2 break-all text-ink-soft">{describeDetails(e)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
