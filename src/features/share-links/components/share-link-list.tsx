/** The bench's share links (never their tokens): what each opens, who made it, until when, and revoke. */
import { formatIsoDateTime } from '../../../lib/dates';
import { Button } from '../../../components/ui/button';
import { EmptyNote, ErrorNote, FormAlert, LoadingNote } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { useRevokeShareLink } from '../api/delete-share-link';
import { useShareLinks } from '../api/get-share-links';

const STATE_TEXT = { active: 'working', expired: 'expired', revoked: 'revoked' } as const;

export function ShareLinkList({ benchId, targetId }: { benchId: string; /** only the links to this analysis or overlay */ targetId?: string }) {
  const links = useShareLinks(benchId);
  const revoke = useRevokeShareLink(benchId);
  if (links.isPending) return <LoadingNote>Loading share links…</LoadingNote>;
  if (links.isError) return <ErrorNote message={links.error.message} onRetry={() => void links.refetch()} />;
  const rows = links.data.shareLinks.filter((l) => !targetId || l.targetId === targetId);
  if (rows.length === 0) return <EmptyNote title="No share links yet">Use “Share” to make a read-only link for someone outside the bench.</EmptyNote>;
  return (
    <div>
      <ul className="divide-y divide-rule/60" aria-label="Share links">
        {rows.map((l) => (
          <li key={l.id} className="flex flex-wrap items-center justify-between gap-3 py-2 text-sm" data-state={l.state}>
            <span className="min-w-0">
              <span className="text-ink">{l.kind === 'analysis' ? 'Spectrum' : 'Overlay'}: {l.targetLabel}</span>
              <span className="block text-xs text-ink-faint">
                made <Mono>{formatIsoDateTime(new Date(l.createdAt))}</Mono>
                {l.createdByName ? ` by ${l.createdByName}` : ''} ·{' '}
                {l.expiresAt ? (
                  <>
                    until <Mono>{formatIsoDateTime(new Date(l.expiresAt))}</Mono>
                  </>
                ) : (
                  'no expiry'
                )}{' '}
                · <strong className="font-medium">{STATE_TEXT[l.state]}</strong>
              </span>
            </span>
            {l.state === 'active' && (
              <Button type="button" size="sm" variant="danger" busy={revoke.isPending && revoke.variables === l.id} onClick={() => revoke.mutate(l.id)}>
                Revoke
              </Button>
            )}
          </li>
        ))}
      </ul>
      <FormAlert message={revoke.error?.message} />
    </div>
  );
}
