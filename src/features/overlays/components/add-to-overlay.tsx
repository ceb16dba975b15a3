/** Add one spectrum to an existing overlay of the bench (it becomes the last trace). */
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { OverlaySummary } from '../../../../server/contracts/overlays';
import { MAX_OVERLAY_TRACES } from '../../../../server/contracts/overlays';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/notes';
import { overlayQueryOptions } from '../api/get-overlay';
import { overlayKeys } from '../api/keys';
import { updateOverlay } from '../api/update-overlay';

export function AddToOverlay({ benchId, analysisId, overlays, onAdded }: { benchId: string; analysisId: string; overlays: readonly OverlaySummary[]; onAdded: (overlayId: string) => void }) {
  const queryClient = useQueryClient();
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  const add = async (overlayId: string) => {
    setBusy(overlayId);
    setError(null);
    try {
      const { overlay } = await queryClient.fetchQuery(overlayQueryOptions(overlayId));
      const ids = overlay.traces.map((t) => t.analysisId);
      if (!ids.includes(analysisId)) {
        const reply = await updateOverlay(overlayId, { analysisIds: [...ids, analysisId] });
        queryClient.setQueryData(overlayKeys.detail(overlayId), reply);
        void queryClient.invalidateQueries({ queryKey: overlayKeys.list(benchId) });
      }
      onAdded(overlayId);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The spectrum could not be added.');
    } finally {
      setBusy(null);
    }
  };

  if (overlays.length === 0) return null;
  return (
    <div>
      <ul className="divide-y divide-rule/60">
        {overlays.map((o) => (
          <li key={o.id} className="flex items-center justify-between gap-3 py-2 text-sm">
            <span className="text-ink">
              {o.name} <span className="text-ink-faint">· {o.traceCount} spectra</span>
            </span>
            <Button type="button" size="sm" variant="secondary" disabled={busy !== null || o.traceCount >= MAX_OVERLAY_TRACES} onClick={() => void add(o.id)}>
              {busy === o.id ? 'Adding…' : 'Add here'}
            </Button>
          </li>
        ))}
      </ul>
      <FormAlert message={error} />
    </div>
  );
}
