/**
 * Upload an RF spectrum-analyser trace (CSV: frequency, power) to the bench. Checked with the server's
 * own contract first; the server reads and fits it and answers 400 with its message when it cannot
 * (an empty file, a non-numeric cell with its line, no shape converging) — nothing is stored then.
 */
import { useState, type FormEvent } from 'react';
import { RfSpectrumUploadFields, type RfSpectrum } from '../../../../server/contracts/rf-spectra';
import type { Laser } from '../../../../server/contracts/lasers';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { useUploadRfSpectrum } from '../api/upload-rf-spectrum';

const FIELDS = ['name', 'powerUnit', 'mode', 'delayS', 'fiberLengthM', 'laserId', 'file'] as const;

export function RfUploadForm({ benchId, lasers, onUploaded }: { benchId: string; lasers: Laser[]; onUploaded: (s: RfSpectrum) => void }) {
  const upload = useUploadRfSpectrum(benchId);
  const [mode, setMode] = useState<'beat' | 'self-heterodyne'>('beat');
  const [delayBy, setDelayBy] = useState<'delay' | 'fibre'>('fibre');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const data = new FormData(event.currentTarget);
    const file = data.get('file');
    const fields: Record<string, string | undefined> = {
      name: formText(data, 'name'),
      powerUnit: formText(data, 'powerUnit') || undefined,
      mode,
      delayS: mode === 'self-heterodyne' && delayBy === 'delay' ? formText(data, 'delayUs') && String(Number(formText(data, 'delayUs').replace(',', '.')) * 1e-6) : undefined,
      fiberLengthM: mode === 'self-heterodyne' && delayBy === 'fibre' ? formText(data, 'fiberLengthKm') && String(Number(formText(data, 'fiberLengthKm').replace(',', '.')) * 1e3) : undefined,
      laserId: formText(data, 'laserId') || undefined,
    };
    const checked = validateWith(RfSpectrumUploadFields, fields);
    const errors: FieldErrors = checked.ok ? {} : { ...checked.fieldErrors };
    if (!(file instanceof File) || file.size === 0) errors.file = 'choose the spectrum file (CSV: frequency, power)';
    setFieldErrors(errors);
    if (Object.keys(errors).length > 0 || !(file instanceof File)) return;
    try {
      const { rfSpectrum } = await upload.mutateAsync({ file, fields });
      onUploaded(rfSpectrum);
    } catch (e) {
      const { fieldErrors: fe, formError: fm } = errorsFromFailure(e, FIELDS);
      setFieldErrors(fe);
      setFormError(fm);
    }
  }

  const delayError = fieldErrors.delayS ?? fieldErrors.fiberLengthM;
  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-[40rem] gap-5" aria-label="Upload an RF spectrum">
      <TextField label="Name" name="name" required maxLength={120} error={fieldErrors.name} placeholder="Beat with the reference, 80 MHz" />
      <div className="flex flex-col gap-1.5">
        <label htmlFor="rf-file" className="text-sm font-medium text-ink">
          Spectrum file
        </label>
        <input id="rf-file" name="file" type="file" accept=".csv,.txt,.tsv,text/csv,text/plain" aria-invalid={fieldErrors.file ? true : undefined} className="text-sm" />
        <p className="text-xs text-ink-faint">
          Two columns: frequency and power. Units from the header (GHz, MHz, kHz, Hz; dBm, mW, W) unless chosen below.
        </p>
        {fieldErrors.file && <p className="text-xs text-danger">{fieldErrors.file}</p>}
      </div>
      <div className="grid grid-cols-2 gap-5">
        <SelectField
          label="Power unit"
          name="powerUnit"
          error={fieldErrors.powerUnit}
          options={[
            { value: '', label: 'From the header' },
            { value: 'dBm', label: 'dBm' },
            { value: 'mW', label: 'mW (linear)' },
            { value: 'W', label: 'W (linear)' },
          ]}
        />
        <SelectField
          label="Laser"
          name="laserId"
          aside="optional"
          error={fieldErrors.laserId}
          options={[{ value: '', label: 'None' }, ...lasers.map((l) => ({ value: l.id, label: l.name }))]}
        />
      </div>
      <fieldset className="grid gap-3">
        <legend className="text-sm font-medium text-ink">Measurement</legend>
        <div className="flex gap-6 text-sm">
          <label className="flex items-center gap-2">
            <input type="radio" name="mode" value="beat" checked={mode === 'beat'} onChange={() => setMode('beat')} /> Beat of two lasers
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" name="mode" value="self-heterodyne" checked={mode === 'self-heterodyne'} onChange={() => setMode('self-heterodyne')} /> Delayed self-heterodyne
          </label>
        </div>
        {mode === 'self-heterodyne' && (
          <div className="grid grid-cols-2 gap-5">
            <SelectField
              label="Delay given as"
              name="delayBy"
              value={delayBy}
              onChange={(e) => setDelayBy(e.target.value as 'delay' | 'fibre')}
              options={[
                { value: 'fibre', label: 'Fibre length' },
                { value: 'delay', label: 'Delay time' },
              ]}
            />
            {delayBy === 'fibre' ? (
              <TextField label="Fibre length" name="fiberLengthKm" inputMode="decimal" unit="km" error={delayError} hint="Group index 1.468 (typical single-mode fibre)." />
            ) : (
              <TextField label="Delay" name="delayUs" inputMode="decimal" unit="µs" error={delayError} />
            )}
          </div>
        )}
      </fieldset>
      <FormAlert message={formError} />
      <div>
        <Button type="submit" disabled={upload.isPending}>
          {upload.isPending ? 'Fitting…' : 'Upload and fit'}
        </Button>
      </div>
    </form>
  );
}
