import { useState } from 'react';
import type { CreatedApiTokenResponse } from '../../../../server/contracts/api-tokens';
import { Button } from '../../../components/ui/button';
import { DoneNote } from '../../../components/ui/notes';

/** The secret of a token just made: shown this once, with a copy button and a curl line to try it. */
export function NewApiTokenSecret({ created, onDismiss }: { created: CreatedApiTokenResponse; onDismiss: () => void }) {
  const [copied, setCopied] = useState<string | null>(null);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(created.secret);
      setCopied('Copied.');
    } catch {
      setCopied('Select the text and copy it by hand.');
    }
  };
  return (
    <div role="status" className="grid gap-3 rounded-[3px] border border-accent/50 bg-paper-card px-5 py-4">
      <p className="text-sm text-ink">
        <span className="font-medium">{created.token.name}</span>: copy this secret now. It is not shown again; the
        server keeps only a fingerprint of it.
      </p>
      <code
        aria-label="API token secret"
        className="block overflow-x-auto rounded-[3px] border border-rule bg-paper-deep px-3 py-2 font-mono text-[0.8125rem] break-all text-ink select-all"
      >
        {created.secret}
      </code>
      <p className="text-xs text-ink-faint">
        Send it as <code className="font-mono">Authorization: Bearer …</code>; it acts as you, with your role on each
        bench.
      </p>
      <div className="flex items-center gap-4">
        <Button type="button" size="sm" variant="secondary" onClick={() => void copy()}>
          Copy secret
        </Button>
        <Button type="button" size="sm" variant="quiet" onClick={onDismiss}>
          I have stored it
        </Button>
        <DoneNote message={copied} className="text-xs" />
      </div>
    </div>
  );
}
