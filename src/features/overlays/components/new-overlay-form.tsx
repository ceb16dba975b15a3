/**
 * Make an overlay: a name and up to eight finished spectra of the bench, ticked in the order they
 * should be drawn (the first ticked takes the first colour).
 */
import { useState, type FormEvent } from 'react';
import { MAX_OVERLAY_TRACES, overlayColor } from '../../../../server/contracts/overlays';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { EmptyNote, FormAlert } from '../../../components/ui/notes';
import { Quantity } from '../../../components/ui/quantity';
import { isApiError } from '../../../lib/api-client';
import { formatSI } from '../../../lib/units';
import { useCreateOverlay } from '../api/create-overlay';

export interface SpectrumChoice {
  analysisId: string;
  fileName: string;
  laserName: string | null;
  intrinsicLinewidthHz: number | null;
}

export function NewOverlayForm({
  benchId,
  choices,
  initial = [],
  onCreated,
}: {
  benchId: string;
  choices: readonly SpectrumChoice[];
  initial?: readonly string[];
  onCreated: (overlayId: string) => void;
}) {
  const [name, setName] = useState('');
  const [picked, setPicked] = useState<string[]>(() => initial.filter((id) => choices.some((c) => c.analysisId === id)));
  const create = useCreateOverlay(benchId);
  const nameError = isApiError(create.error) ? create.error.details.find((d) => d.path === 'name')?.message : undefined;

  const toggle = (id: string) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length >= MAX_OVERLAY_TRACES ? p : [...p, id]));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    create.mutate({ name, analysisIds: picked }, { onSuccess: ({ overlay }) => onCreated(overlay.id) });
  };

  if (choices.length === 0) {
    return <EmptyNote title="No finished spectra yet">Upload captures and let them be analysed; their spectra can then be compared here.</EmptyNote>;
  }

  return (
    <form onSubmit={submit} className="space-y-5" aria-label="New overlay">
      <TextField label="Overlay name" value={name} onChange={(e) => setName(e.target.value)} required maxLength={120} error={nameError} placeholder="e.g. Three lasers at 1550 nm" />
      <fieldset>
        <legend className="text-sm font-medium text-ink">
          Spectra <span className="font-normal text-ink-faint">({picked.length} of at most {MAX_OVERLAY_TRACES}; drawn in the order ticked)</span>
        </legend>
        <ul className="mt-2 divide-y divide-rule/60 rounded-[4px] border border-rule bg-paper-card">
          {choices.map((c) => {
            const position = picked.indexOf(c.analysisId);
            return (
              <li key={c.analysisId}>
                <label className="flex cursor-pointer items-center gap-3 px-3 py-2 text-sm">
                  <input type="checkbox" checked={position >= 0} onChange={() => toggle(c.analysisId)} disabled={position < 0 && picked.length >= MAX_OVERLAY_TRACES} />
                  <span aria-hidden="true" className="inline-block h-[3px] w-5" style={{ backgroundColor: position >= 0 ? overlayColor(position) : 'transparent' }} />
                  <span className="min-w-0 flex-1 break-all text-ink">{c.fileName}</span>
                  <span className="text-ink-faint">{c.laserName ?? 'no laser'}</span>
                  <span className="w-24 text-right">{c.intrinsicLinewidthHz === null ? '—' : <Quantity q={formatSI(c.intrinsicLinewidthHz, 'Hz')} />}</span>
                </label>
              </li>
            );
          })}
        </ul>
      </fieldset>
      <FormAlert message={create.error && !nameError ? create.error.message : null} />
      <Button type="submit" disabled={create.isPending || picked.length === 0 || name.trim() === ''}>
        {create.isPending ? 'Saving…' : 'Save overlay'}
      </Button>
    </form>
  );
}
