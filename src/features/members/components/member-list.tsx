import { useState } from 'react';
import { BenchRole, type Member } from '../../../../server/contracts/benches';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DoneNote, FormAlert } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { RoleTag } from '../../../components/ui/role-tag';
import { formatIsoDate, formatIsoDateTime } from '../../../lib/dates';
import { useRemoveMember } from '../api/remove-member';
import { useUpdateMemberRole } from '../api/update-member-role';

export interface MemberListProps {
  benchId: string;
  benchName: string;
  members: Member[];
  currentUserId: string;
  /** owners change roles and remove people */
  canManage: boolean;
  /** after a change that alters the bench's counts */
  onChanged?: () => void;
  /** after the signed-in person left the bench (leave its pages) */
  onLeft: () => unknown;
}

const ROLE_ORDER: Record<BenchRole, number> = { owner: 0, analyst: 1, viewer: 2 };

export function MemberList({ benchId, benchName, members, currentUserId, canManage, onChanged, onLeft }: MemberListProps) {
  const sorted = [...members].sort((a, b) => ROLE_ORDER[a.role] - ROLE_ORDER[b.role] || a.name.localeCompare(b.name));
  return (
    <table className="w-full border-collapse text-left">
      <caption className="sr-only">Members of {benchName}</caption>
      <thead>
        <tr className="border-b border-rule-strong text-xs tracking-[0.06em] text-ink-faint uppercase">
          <th scope="col" className="py-2 pr-4 font-medium">Name</th>
          <th scope="col" className="py-2 pr-4 font-medium">E-mail</th>
          <th scope="col" className="py-2 pr-4 font-medium">Role</th>
          <th scope="col" className="py-2 pr-4 font-medium">Joined</th>
          <th scope="col" className="py-2 text-right font-medium">
            <span className="sr-only">Actions</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {sorted.map((m) => (
          <MemberRow
            key={m.userId}
            benchId={benchId}
            benchName={benchName}
            member={m}
            isSelf={m.userId === currentUserId}
            canManage={canManage}
            onChanged={onChanged}
            onLeft={onLeft}
          />
        ))}
      </tbody>
    </table>
  );
}

interface MemberRowProps {
  benchId: string;
  benchName: string;
  member: Member;
  isSelf: boolean;
  canManage: boolean;
  onChanged?: () => void;
  onLeft: () => unknown;
}

function MemberRow({ benchId, benchName, member, isSelf, canManage, onChanged, onLeft }: MemberRowProps) {
  const [role, setRole] = useState<BenchRole>(member.role);
  const [confirming, setConfirming] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const updateRole = useUpdateMemberRole(benchId, { onChanged });
  const remove = useRemoveMember(benchId, {
    onChanged: () => {
      onChanged?.();
      return isSelf ? onLeft() : undefined;
    },
  });
  const roleChanged = role !== member.role;

  return (
    <tr className="border-b border-rule align-top">
      <td className="py-3.5 pr-4">
        <span className="font-medium text-ink">{member.name}</span>
        {isSelf && <span className="ml-2 text-xs text-ink-faint">(you)</span>}
      </td>
      <td className="py-3.5 pr-4">
        <Mono className="text-[0.8125rem] text-ink-soft">{member.email}</Mono>
      </td>
      <td className="py-3 pr-4">
        {canManage ? (
          <div className="flex flex-col gap-1.5">
            <form
              className="flex items-center gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                setDone(null);
                updateRole.mutate({ userId: member.userId, role }, { onSuccess: () => setDone('Role changed.') });
              }}
            >
              <select
                aria-label={`Role of ${member.name}`}
                value={role}
                onChange={(e) => {
                  setRole(BenchRole.parse(e.target.value));
                  setDone(null);
                  updateRole.reset();
                }}
                className="select-chevron h-8 rounded-[3px] border border-rule-strong bg-paper-card pr-8 pl-2.5 text-sm text-ink hover:border-ink-faint"
              >
                {BenchRole.options.map((r) => (
                  <option key={r} value={r}>
                    {r}
                  </option>
                ))}
              </select>
              {roleChanged && (
                <Button type="submit" size="sm" variant="secondary" busy={updateRole.isPending} busyLabel="Saving…">
                  Change role
                </Button>
              )}
            </form>
            <DoneNote message={done} className="text-xs" />
            <FormAlert message={updateRole.error?.message} className="text-xs" />
          </div>
        ) : (
          <RoleTag role={member.role} />
        )}
      </td>
      <td className="py-3.5 pr-4">
        <Mono className="text-sm whitespace-nowrap text-ink-soft" title={formatIsoDateTime(member.joinedAt)}>
          {formatIsoDate(member.joinedAt)}
        </Mono>
      </td>
      <td className="py-3 text-right">
        {(isSelf || canManage) && (
          <Button variant="quiet" size="sm" className="text-danger hover:text-danger" onClick={() => setConfirming(true)}>
            {isSelf ? 'Leave bench' : 'Remove'}
          </Button>
        )}
        <ConfirmDialog
          open={confirming}
          title={isSelf ? `Leave “${benchName}”?` : `Remove ${member.name}?`}
          confirmLabel={isSelf ? 'Leave bench' : 'Remove member'}
          busy={remove.isPending}
          error={remove.error?.message}
          onConfirm={() => remove.mutate(member.userId)}
          onClose={() => {
            setConfirming(false);
            remove.reset();
          }}
        >
          {isSelf
            ? 'You will no longer see this bench, its lasers or its captures. An owner can add you again.'
            : `${member.name} will no longer see this bench. An owner can add them again later.`}
        </ConfirmDialog>
      </td>
    </tr>
  );
}
