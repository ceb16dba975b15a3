/**
 * Adding a capture to a bench: the file (dropped or chosen), a preview from its first bytes, a form
 * for what the file cannot tell (and how it was taken), the analysis settings folded away, then the
 * upload with a progress bar for the bytes and the first analysis with its stage and percentage.
 * When the analysis is done the page moves on to the spectrum (`onAnalysed`).
 * Every failure is said beside the upload button: the engine's reason for a file it cannot read
 * (400), the size cap (413), a role that may not upload (403).
 */
import { useEffect, useId, useRef, useState, type FormEvent, type ReactNode } from 'react';
import { WindowName } from '../../../../server/contracts/analyses';
import {
  ByteOrder,
  CaptureFormat,
  CaptureKind,
  CaptureSetup,
  CaptureUploadFields,
  RawDtype,
  type CaptureUploadFields as UploadFieldsText,
  type CreateCaptureResponse,
} from '../../../../server/contracts/captures';
import type { Laser } from '../../../../server/contracts/lasers';
import { LaserSafetyNote } from '../../../components/layout/laser-safety-note';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { isApiError } from '../../../lib/api-client';
import { asSentence, errorsFromFailure, validateWith, type FieldErrors } from '../../../lib/form';
import { formatSI } from '../../../lib/units';
import { useUploadAnalysis } from '../api/get-upload-analysis';
import { isAbort, useUploadCapture } from '../api/upload-capture';
import { FORMAT_LABELS, KIND_LABELS, SETUP_LABELS, stageLabel, WINDOW_LABELS } from './capture-labels';
import { CapturePreviewPanel } from './capture-preview';
import { FileDrop } from './file-drop';
import { ProgressBar } from './progress-bar';
import { useFilePreview } from './use-file-preview';

export interface CaptureUploadProps {
  benchId: string;
  lasers: readonly Laser[];
  /** the laser chosen at the start (e.g. when coming from a laser's page) */
  defaultLaserId?: string;
  /** called once the first analysis is done, with its id */
  onAnalysed: (analysisId: string) => void;
}

type FormState = {
  format: string;
  dtype: string;
  channels: string;
  byteOrder: string;
  kind: string;
  sampleRateHz: string;
  laserId: string;
  setup: string;
  referenceLinewidthHz: string;
  delayUs: string;
  driveCurrentMa: string;
  temperatureC: string;
  outputPowerMw: string;
  notes: string;
  tags: string;
  window: string;
  segment: string;
  overlap: string;
  observationTimeMs: string;
};

const EMPTY: FormState = {
  format: '',
  dtype: '',
  channels: '',
  byteOrder: '',
  kind: '',
  sampleRateHz: '',
  laserId: '',
  setup: '',
  referenceLinewidthHz: '',
  delayUs: '',
  driveCurrentMa: '',
  temperatureC: '',
  outputPowerMw: '',
  notes: '',
  tags: '',
  window: '',
  segment: '',
  overlap: '',
  observationTimeMs: '',
};

/** contract field → the form field that shows its message */
const FIELD_OF: Record<string, keyof FormState> = {
  kind: 'kind',
  sampleRateHz: 'sampleRateHz',
  format: 'format',
  dtype: 'dtype',
  channels: 'channels',
  byteOrder: 'byteOrder',
  laserId: 'laserId',
  setup: 'setup',
  setupParams: 'setup',
  'setupParams.referenceLinewidthHz': 'referenceLinewidthHz',
  'setupParams.delayS': 'delayUs',
  driveCurrentMa: 'driveCurrentMa',
  temperatureC: 'temperatureC',
  outputPowerMw: 'outputPowerMw',
  notes: 'notes',
  tags: 'tags',
  window: 'window',
  segment: 'segment',
  overlap: 'overlap',
  observationTimeS: 'observationTimeMs',
  floorBandHz: 'observationTimeMs',
};

const CONTRACT_FIELDS = Object.keys(FIELD_OF);

const num = (text: string) => text.trim().replace(',', '.');

/** "10e6" → "10.0 MHz" beside a number field; nothing while it is not a number. */
function echo(text: string, unit: string): string | undefined {
  const t = num(text);
  if (t === '') return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? `= ${formatSI(v, unit, { significant: 4, trim: true }).text}` : undefined;
}

/** The form as the multipart text fields the contract names. */
function toUploadFields(s: FormState): UploadFieldsText {
  const fields: UploadFieldsText = {};
  const put = (k: keyof UploadFieldsText, v: string) => {
    if (v.trim() !== '') fields[k] = v.trim();
  };
  put('format', s.format);
  if (s.format === 'raw') {
    put('dtype', s.dtype);
    put('channels', s.channels);
    put('byteOrder', s.byteOrder);
  }
  put('kind', s.kind);
  put('sampleRateHz', num(s.sampleRateHz));
  put('laserId', s.laserId);
  put('setup', s.setup);
  if (s.setup === 'heterodyne' && num(s.referenceLinewidthHz) !== '') {
    fields.setupParams = JSON.stringify({ referenceLinewidthHz: Number(num(s.referenceLinewidthHz)) });
  }
  if (s.setup === 'self-heterodyne' && num(s.delayUs) !== '') {
    // the form asks in µs (5 µs ≈ 1 km of fibre); the API takes seconds
    fields.setupParams = JSON.stringify({ delayS: Number(num(s.delayUs)) * 1e-6 });
  }
  put('driveCurrentMa', num(s.driveCurrentMa));
  put('temperatureC', num(s.temperatureC));
  put('outputPowerMw', num(s.outputPowerMw));
  put('notes', s.notes);
  put('tags', s.tags);
  put('window', s.window);
  put('segment', num(s.segment));
  put('overlap', num(s.overlap));
  if (num(s.observationTimeMs) !== '') fields.observationTimeS = String(Number(num(s.observationTimeMs)) / 1000);
  return fields;
}

function mapErrors(errors: FieldErrors): Partial<Record<keyof FormState, string>> {
  const out: Partial<Record<keyof FormState, string>> = {};
  for (const [path, message] of Object.entries(errors)) {
    const field = FIELD_OF[path] ?? FIELD_OF[path.split('.')[0]];
    if (field && message && out[field] === undefined) out[field] = message;
  }
  return out;
}

function Fieldset({ legend, lede, columns = 2, children }: { legend: string; lede?: ReactNode; columns?: 2 | 3; children: ReactNode }) {
  return (
    <fieldset className="border-t border-rule pt-5">
      <legend className="pr-3 text-xs font-semibold tracking-[0.08em] text-ink-soft uppercase">{legend}</legend>
      {lede && <p className="-mt-1 mb-4 text-sm text-ink-faint">{lede}</p>}
      <div className={columns === 3 ? 'grid grid-cols-3 gap-x-5 gap-y-4' : 'grid grid-cols-2 gap-x-6 gap-y-4'}>{children}</div>
    </fieldset>
  );
}

export function CaptureUpload({ benchId, lasers, defaultLaserId, onAnalysed }: CaptureUploadProps) {
  const [file, setFile] = useState<File | null>(null);
  const [form, setForm] = useState<FormState>({ ...EMPTY, laserId: defaultLaserId ?? '' });
  const [errors, setErrors] = useState<Partial<Record<keyof FormState, string>>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [uploaded, setUploaded] = useState<CreateCaptureResponse | null>(null);
  const upload = useUploadCapture(benchId);
  const analysis = useUploadAnalysis(uploaded?.analysis.id ?? null);
  const statusId = useId();
  const announced = useRef<string | null>(null);

  const rawChoices = form.format === 'raw';
  const previewState = useFilePreview(file, {
    format: form.format ? CaptureFormat.parse(form.format) : undefined,
    dtype: rawChoices && form.dtype ? RawDtype.parse(form.dtype) : undefined,
    channels: rawChoices && form.channels ? (Number(form.channels) as 1 | 2) : undefined,
    byteOrder: rawChoices && form.byteOrder ? ByteOrder.parse(form.byteOrder) : undefined,
  });
  const preview = previewState.status === 'ready' ? previewState.preview : null;
  const needsRate = preview ? preview.needs.includes('sampleRateHz') : false;
  const needsKind = preview ? preview.needs.includes('kind') : false;
  const isRaw = form.format === 'raw' || preview?.format === 'raw';

  // the file told us its format as raw: show the raw options by choosing raw explicitly
  useEffect(() => {
    if (preview?.format === 'raw' && form.format === '') setForm((f) => ({ ...f, format: 'raw', channels: f.channels || '1' }));
  }, [preview?.format, form.format]);

  // when the first analysis is done, move on to its spectrum (once)
  const current = analysis.data;
  useEffect(() => {
    if (current?.status === 'done' && announced.current !== current.id) {
      announced.current = current.id;
      onAnalysed(current.id);
    }
  }, [current?.status, current?.id, onAnalysed]);

  const set = (key: keyof FormState) => (value: string) => {
    setForm((f) => ({ ...f, [key]: value }));
    setErrors((e) => ({ ...e, [key]: undefined }));
  };
  const bind = (key: keyof FormState) => ({
    name: key,
    value: form[key],
    error: errors[key],
    onChange: (e: { currentTarget: { value: string } }) => set(key)(e.currentTarget.value),
  });

  // after a refused submit, the first field with a message takes the focus
  const formRef = useRef<HTMLFormElement>(null);
  const [focusTick, setFocusTick] = useState(0);
  useEffect(() => {
    if (focusTick === 0) return;
    formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [focusTick]);

  const busy = upload.isPending;
  const started = uploaded !== null;

  function chooseFile(next: File | null) {
    setFile(next);
    setFormError(null);
    setUploaded(null);
    upload.clear();
    // what the last file said is not what this one says
    setForm((f) => ({ ...f, format: '', dtype: '', channels: '', byteOrder: '' }));
  }

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    if (!file) {
      setFormError('Choose a capture file first.');
      return;
    }
    const next: Partial<Record<keyof FormState, string>> = {};
    if (needsRate && num(form.sampleRateHz) === '') next.sampleRateHz = 'the file does not state its sample rate: give it in Hz, e.g. 10e6';
    if (needsKind && form.kind === '') next.kind = 'the file does not say what it holds: choose the kind';
    if (isRaw && form.dtype === '') next.dtype = 'a raw binary file needs its sample type';
    const fields = toUploadFields(form);
    const checked = validateWith(CaptureUploadFields, fields);
    if (!checked.ok) Object.assign(next, mapErrors(checked.fieldErrors), next);
    if (Object.values(next).some(Boolean)) {
      setErrors(next);
      setFormError('Some fields need a look: see the messages beside them.');
      setFocusTick((t) => t + 1);
      return;
    }
    setErrors({});
    upload.mutate(
      { file, fields },
      {
        onSuccess: (response) => setUploaded(response),
        onError: (error) => {
          if (isAbort(error)) {
            setFormError('Upload cancelled. Nothing was stored.');
            return;
          }
          if (isApiError(error) && (error.status === 413 || error.status === 403 || error.status === 400 || error.status === 404)) {
            const e = errorsFromFailure(error, CONTRACT_FIELDS);
            setErrors(mapErrors(e.fieldErrors));
            if (error.code === 'bad_input') {
              // the engine's own reason, as it gave it
              setFormError(`The analysis engine cannot read this file as it is: ${asSentence(error.message)} Nothing was stored.`);
            } else if (error.status === 413) {
              setFormError(`${asSentence(error.message)} Nothing was stored.`);
            } else {
              setFormError(e.formError ?? (Object.keys(e.fieldErrors).length ? 'Some fields need a look: see the messages beside them.' : asSentence(error.message)));
            }
            return;
          }
          setFormError(isApiError(error) ? error.message : 'The upload failed in the page itself. Reload and try again.');
        },
      },
    );
  }

  function startOver() {
    setFile(null);
    setUploaded(null);
    setFormError(null);
    upload.clear();
    setForm({ ...EMPTY, laserId: form.laserId, setup: form.setup, referenceLinewidthHz: form.referenceLinewidthHz, delayUs: form.delayUs });
  }

  const laserOptions = [{ value: '', label: 'No laser named' }, ...[...lasers].sort((a, b) => a.name.localeCompare(b.name)).map((l) => ({ value: l.id, label: l.name }))];
  const kindOptions = [
    { value: '', label: preview?.kindGuess ? `As the file says: ${KIND_LABELS[preview.kindGuess]}` : 'Choose…' },
    ...CaptureKind.options.map((k) => ({ value: k, label: KIND_LABELS[k] })),
  ];
  const formatOptions = [
    { value: '', label: preview ? `As recognised: ${FORMAT_LABELS[preview.format]}` : 'Recognise from the file' },
    ...CaptureFormat.options.map((f) => ({ value: f, label: FORMAT_LABELS[f] })),
  ];
  const setupOptions = [{ value: '', label: 'Not said' }, ...CaptureSetup.options.map((s) => ({ value: s, label: SETUP_LABELS[s] }))];
  const windowOptions = [{ value: '', label: 'Engine default (Hann)' }, ...WindowName.options.map((w) => ({ value: w, label: WINDOW_LABELS[w] }))];

  const bytes = upload.progress;
  const a = current;

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-describedby={statusId} data-testid="capture-upload">
      <div className="grid grid-cols-[minmax(0,1fr)_minmax(18rem,22rem)] gap-10">
        <div className="flex min-w-0 flex-col gap-7">
          <FileDrop file={file} onFile={chooseFile} disabled={busy || started} />
          <LaserSafetyNote className="-mt-3" />

          <Fieldset legend="What the file cannot tell" lede="Only what the preview could not find is required; the rest helps colleagues read the spectrum later.">
            <SelectField label="Format" options={formatOptions} {...bind('format')} disabled={busy || started} />
            <SelectField
              label="Kind"
              options={kindOptions}
              aside={needsKind ? 'required' : undefined}
              {...bind('kind')}
              disabled={busy || started}
            />
            <TextField
              label="Sample rate"
              unit="Hz"
              inputMode="decimal"
              placeholder={preview?.sampleRateHz ? String(preview.sampleRateHz) : 'e.g. 10e6'}
              aside={needsRate ? 'required' : preview?.sampleRateHz ? 'the file states it' : undefined}
              hint={echo(form.sampleRateHz, 'Hz') ?? (preview?.sampleRateHz ? 'Leave empty to use the rate the file states.' : undefined)}
              {...bind('sampleRateHz')}
              disabled={busy || started}
            />
            {isRaw && (
              <>
                <SelectField
                  label="Sample type"
                  options={[{ value: '', label: 'Choose…' }, ...RawDtype.options.map((d) => ({ value: d, label: d }))]}
                  aside="required"
                  {...bind('dtype')}
                  disabled={busy || started}
                />
                <SelectField
                  label="Channels"
                  options={[
                    { value: '1', label: '1 (real)' },
                    { value: '2', label: '2 (I, Q interleaved)' },
                  ]}
                  {...bind('channels')}
                  disabled={busy || started}
                />
                <SelectField
                  label="Byte order"
                  options={[
                    { value: '', label: 'little-endian (default)' },
                    { value: 'big', label: 'big-endian' },
                  ]}
                  {...bind('byteOrder')}
                  disabled={busy || started}
                />
              </>
            )}
          </Fieldset>

          <Fieldset legend="How it was taken">
            <SelectField label="Laser" options={laserOptions} {...bind('laserId')} disabled={busy || started} />
            <SelectField label="Setup" options={setupOptions} {...bind('setup')} disabled={busy || started} />
            {form.setup === 'heterodyne' && (
              <TextField
                label="Reference laser linewidth"
                unit="Hz"
                inputMode="decimal"
                placeholder="e.g. 100"
                hint={echo(form.referenceLinewidthHz, 'Hz') ?? 'The quieter laser the device was beaten against.'}
                {...bind('referenceLinewidthHz')}
                disabled={busy || started}
              />
            )}
            {form.setup === 'self-heterodyne' && (
              <TextField
                label="Delay of the fibre arm"
                unit="µs"
                inputMode="decimal"
                placeholder="e.g. 5"
                hint="About 5 µs per kilometre of fibre."
                {...bind('delayUs')}
                disabled={busy || started}
              />
            )}
          </Fieldset>

          <Fieldset legend="Operating point" columns={3}>
            <TextField label="Drive current" unit="mA" inputMode="decimal" {...bind('driveCurrentMa')} disabled={busy || started} />
            <TextField label="Temperature" unit="°C" inputMode="decimal" {...bind('temperatureC')} disabled={busy || started} />
            <TextField label="Output power" unit="mW" inputMode="decimal" {...bind('outputPowerMw')} disabled={busy || started} />
          </Fieldset>

          <Fieldset legend="Notes and tags">
            <TextAreaField label="Notes" fieldClassName="col-span-2" placeholder="What changed on the bench, what to look for" {...bind('notes')} disabled={busy || started} />
            <TextField
              label="Tags"
              fieldClassName="col-span-2"
              placeholder="e.g. after-isolator, 2-km-delay"
              hint="Separate tags with commas."
              {...bind('tags')}
              disabled={busy || started}
            />
          </Fieldset>

          <details className="border-t border-rule pt-4 [&[open]>summary]:mb-4" data-testid="upload-analysis-settings">
            <summary className="cursor-pointer text-xs font-semibold tracking-[0.08em] text-ink-soft uppercase">Analysis settings</summary>
            <p className="mb-4 text-sm text-ink-faint">Left empty, each takes the engine's default; the spectrum page can run the analysis again with others.</p>
            <div className="grid grid-cols-2 gap-x-6 gap-y-4">
              <SelectField label="Window" options={windowOptions} {...bind('window')} disabled={busy || started} />
              <TextField label="Segment" unit="samples" inputMode="numeric" placeholder="automatic" hint="Welch segment length." {...bind('segment')} disabled={busy || started} />
              <TextField label="Overlap" inputMode="decimal" placeholder="0.5" hint="Fraction of a segment, 0 to below 1." {...bind('overlap')} disabled={busy || started} />
              <TextField
                label="Observation time"
                unit="ms"
                inputMode="decimal"
                placeholder="record length"
                hint="T₀ of the β-line and the lineshape."
                {...bind('observationTimeMs')}
                disabled={busy || started}
              />
            </div>
          </details>

          <div className="flex flex-col gap-4 border-t border-rule pt-5">
            <div className="flex items-center gap-4">
              {!started && (
                <Button type="submit" busy={busy} busyLabel="Uploading…" disabled={!file}>
                  Upload and analyse
                </Button>
              )}
              {busy && (
                <Button variant="quiet" onClick={upload.cancel}>
                  Cancel the upload
                </Button>
              )}
              {started && (a?.status === 'failed' || a?.status === 'done') && (
                <Button variant="secondary" onClick={startOver}>
                  Upload another capture
                </Button>
              )}
            </div>
            <div id={statusId} aria-live="polite" className="flex flex-col gap-3">
              {bytes && (busy || started) && (
                <ProgressBar
                  testId="upload-bytes"
                  label={started ? 'Uploaded' : 'Uploading'}
                  value={bytes.total > 0 ? bytes.loaded / bytes.total : null}
                  figure={
                    <>
                      {formatSI(bytes.loaded, 'B', { significant: 3 }).text} of {formatSI(bytes.total, 'B', { significant: 3 }).text}
                    </>
                  }
                  tone={started ? 'ok' : 'accent'}
                />
              )}
              {uploaded?.duplicateOf && (
                <p className="text-sm text-caution">The same file is already on this bench; it was stored again as a separate capture.</p>
              )}
              {started && (
                <ProgressBar
                  testId="analysis-progress"
                  label={
                    a?.status === 'failed'
                      ? 'Analysis failed'
                      : a?.status === 'done'
                        ? 'Analysed — opening the spectrum'
                        : a?.status === 'running'
                          ? `Analysing · ${stageLabel(a.stage)}`
                          : 'Waiting for an analysis worker'
                  }
                  value={a ? (a.status === 'queued' ? null : a.status === 'failed' ? 1 : a.progress) : null}
                  figure={a && a.status !== 'queued' ? <Mono>{Math.round(a.progress * 100)} %</Mono> : undefined}
                  tone={a?.status === 'failed' ? 'danger' : a?.status === 'done' ? 'ok' : 'accent'}
                />
              )}
              {a?.status === 'failed' && (
                <FormAlert message={`The engine could not analyse this capture: ${a.error ?? 'no reason was given'}. Check the kind and sample rate, then upload it again.`} />
              )}
              {analysis.isError && <FormAlert message={isApiError(analysis.error) ? analysis.error.message : 'The analysis could not be followed.'} />}
            </div>
            <div data-testid="upload-error">
              <FormAlert message={formError} />
            </div>
          </div>
        </div>

        <aside className="min-w-0">
          <div className="sticky top-6 rounded-[4px] border border-rule bg-paper-card px-5 pt-4 pb-5">
            <h2 className="mb-3 text-base font-semibold tracking-tight text-ink">What the file says</h2>
            <CapturePreviewPanel state={previewState} fileSize={file?.size ?? null} givenRateHz={Number(num(form.sampleRateHz)) || null} />
          </div>
        </aside>
      </div>
    </form>
  );
}
