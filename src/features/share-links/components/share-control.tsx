/**
 * "Share": makes a read-only link to a spectrum or an overlay for people outside the bench, with an
 * optional expiry. The address (with its token) is shown this once, to copy; the bench keeps only a
 * fingerprint of it and can revoke it later.
 */
import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/notes';
import { useCreateShareLink, type ShareTarget } from '../api/create-share-link';

const EXPIRY_CHOICES = [
  { value: '', label: 'until revoked' },
  { value: '1', label: '1 day' },
  { value: '7', label: '7 days' },
  { value: '30', label: '30 days' },
  { value: '90', label: '90 days' },
];

export function ShareControl({ benchId, target }: { benchId: string; target: ShareTarget }) {
  const [open, setOpen] = useState(false);
  const [days, setDays] = useState('7');
  const [url, setUrl] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);
  const create = useCreateShareLink(benchId, target);
  const selectId = useId();

  const make = () => {
    const expiresAt = days ? new Date(Date.now() + Number(days) * 86_400_000).toISOString() : undefined;
    create.mutate(expiresAt ? { expiresAt } : {}, { onSuccess: (r) => setUrl(r.url) });
  };

  const copy = async () => {
    if (!url) return;
    try {
      await navigator.clipboard.writeText(url);
      setCopied(true);
    } catch {
      setCopied(false);
    }
  };

  if (!open) {
    return (
      <Button type="button" variant="secondary" onClick={() => setOpen(true)}>
        Share
      </Button>
    );
  }
  return (
    <div className="w-full max-w-md rounded-[4px] border border-rule bg-paper-card px-4 py-3 text-sm" role="group" aria-label="Share a read-only link">
      {url ? (
        <>
          <p className="text-ink">Anyone with this address can read it without signing in. It is shown only now.</p>
          <div className="mt-2 flex gap-2">
            <input readOnly value={url} aria-label="Share link" className="h-9 min-w-0 flex-1 rounded-[3px] border border-rule bg-paper px-2 font-mono text-xs" onFocus={(e) => e.currentTarget.select()} />
            <Button type="button" size="sm" variant="secondary" onClick={() => void copy()}>
              {copied ? 'Copied' : 'Copy'}
            </Button>
          </div>
          <div className="mt-2 flex gap-3">
            <Button type="button" size="sm" variant="quiet" onClick={() => { setUrl(null); setCopied(false); setOpen(false); }}>
              Done
            </Button>
          </div>
        </>
      ) : (
        <>
          <label htmlFor={selectId} className="block text-ink">
            Link works for
          </label>
          <div className="mt-1 flex items-center gap-2">
            <select id={selectId} value={days} onChange={(e) => setDays(e.target.value)} className="h-9 rounded-[3px] border border-rule bg-paper px-2">
              {EXPIRY_CHOICES.map((c) => (
                <option key={c.value} value={c.value}>
                  {c.label}
                </option>
              ))}
            </select>
            <Button type="button" size="sm" onClick={make} busy={create.isPending} busyLabel="Making…">
              Make link
            </Button>
            <Button type="button" size="sm" variant="quiet" onClick={() => setOpen(false)}>
              Cancel
            </Button>
          </div>
          <FormAlert message={create.error?.message} />
        </>
      )}
    </div>
  );
}
