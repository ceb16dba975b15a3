import { useState } from 'react';
import type { ApiToken } from '../../../../server/contracts/api-tokens';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Mono } from '../../../components/ui/quantity';
import { formatIsoDate, formatIsoDateTime } from '../../../lib/dates';
import { useRevokeApiToken } from '../api/revoke-api-token';

function When({ value, empty }: { value: string | null; empty: string }) {
  if (!value) return <span className="text-sm text-ink-faint">{empty}</span>;
  return (
    <Mono className="text-sm whitespace-nowrap text-ink-soft" title={formatIsoDateTime(value)}>
      {formatIsoDate(value)}
    </Mono>
  );
}

/** My tokens: name, visible prefix, dates, and revoking (with a confirmation). */
export function ApiTokenList({ tokens }: { tokens: ApiToken[] }) {
  if (tokens.length === 0) return <p className="text-sm text-ink-faint">No API tokens yet.</p>;
  return (
    <table className="w-full border-collapse text-left">
      <caption className="sr-only">Your API tokens</caption>
      <thead>
        <tr className="border-b border-rule-strong text-xs tracking-[0.06em] text-ink-faint uppercase">
          <th scope="col" className="py-2 pr-4 font-medium">Name</th>
          <th scope="col" className="py-2 pr-4 font-medium">Starts with</th>
          <th scope="col" className="py-2 pr-4 font-medium">Made</th>
          <th scope="col" className="py-2 pr-4 font-medium">Last used</th>
          <th scope="col" className="py-2 pr-4 font-medium">Valid until</th>
          <th scope="col" className="py-2 text-right font-medium">
            <span className="sr-only">Actions</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {tokens.map((t) => (
          <ApiTokenRow key={t.id} token={t} />
        ))}
      </tbody>
    </table>
  );
}

function ApiTokenRow({ token }: { token: ApiToken }) {
  const [confirming, setConfirming] = useState(false);
  const revoke = useRevokeApiToken();
  return (
    <tr className="border-b border-rule align-top">
      <td className="py-3.5 pr-4 font-medium text-ink">{token.name}</td>
      <td className="py-3.5 pr-4">
        <Mono className="text-[0.8125rem] text-ink-soft">{token.prefix}…</Mono>
      </td>
      <td className="py-3.5 pr-4">
        <When value={token.createdAt} empty="—" />
      </td>
      <td className="py-3.5 pr-4">
        <When value={token.lastUsedAt} empty="never" />
      </td>
      <td className="py-3.5 pr-4">
        <When value={token.expiresAt} empty="until revoked" />
      </td>
      <td className="py-3 text-right">
        <Button variant="quiet" size="sm" className="text-danger hover:text-danger" onClick={() => setConfirming(true)}>
          Revoke
        </Button>
        <ConfirmDialog
          open={confirming}
          title={`Revoke “${token.name}”?`}
          confirmLabel="Revoke token"
          busy={revoke.isPending}
          error={revoke.error?.message}
          onConfirm={() => revoke.mutate(token.id, { onSuccess: () => setConfirming(false) })}
          onClose={() => {
            setConfirming(false);
            revoke.reset();
          }}
        >
          Scripts using it are refused from the next request on. This cannot be undone; make a new token if needed.
        </ConfirmDialog>
      </td>
    </tr>
  );
}
