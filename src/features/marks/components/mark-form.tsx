/**
 * The form that adds a mark or edits one: kind, a frequency or a band [lo, hi] in Hz, and a text.
 * Checked with the server's own contract before sending; the server's answer (a place outside the
 * spectrum's band) comes back on the same fields.
 */
import { useId, useState, type FormEvent } from 'react';
import { CreateMarkRequest, MARK_TEXT_MAX, type Mark, type MarkKind } from '../../../../server/contracts/marks';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, formNumber, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { formatSI } from '../../../lib/units';
import { MARK_KINDS, markKindLabel } from './mark-style';

export interface MarkFormProps {
  /** where marks may sit, [lowest frequency, Nyquist] Hz */
  bandHz: readonly [number, number] | null;
  /** the mark being edited; a new one when absent */
  mark?: Mark;
  submitLabel: string;
  busy: boolean;
  /** the failed request, mapped back onto the fields */
  failure: unknown;
  onSubmit: (body: CreateMarkRequest) => void;
  onCancel?: () => void;
}

const FIELDS = ['kind', 'text', 'frequencyHz', 'bandHz'] as const;

export function MarkForm({ bandHz, mark, submitLabel, busy, failure, onSubmit, onCancel }: MarkFormProps) {
  const id = useId();
  const [place, setPlace] = useState<'frequency' | 'band'>(mark?.bandHz ? 'band' : 'frequency');
  const [checked, setChecked] = useState<FieldErrors>({});
  const server = failure ? errorsFromFailure(failure, FIELDS) : { fieldErrors: {}, formError: null };
  const errors: FieldErrors = { ...server.fieldErrors, ...checked };

  const submit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const data = new FormData(e.currentTarget);
    const values = {
      kind: formText(data, 'kind') as MarkKind,
      text: formText(data, 'text'),
      ...(place === 'frequency'
        ? { frequencyHz: formNumber(data, 'frequencyHz') ?? Number.NaN }
        : { bandHz: [formNumber(data, 'loHz') ?? Number.NaN, formNumber(data, 'hiHz') ?? Number.NaN] }),
    };
    const result = validateWith(CreateMarkRequest, values);
    if (!result.ok) {
      setChecked(result.fieldErrors);
      return;
    }
    setChecked({});
    onSubmit(result.data);
  };

  const bandHint = bandHz ? `Between ${formatSI(bandHz[0], 'Hz').text} and ${formatSI(bandHz[1], 'Hz').text}.` : undefined;
  const bandError = errors['bandHz.0'] ?? errors['bandHz.1'] ?? errors.bandHz;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label={submitLabel} data-testid="mark-form">
      <SelectField
        label="Kind"
        name="kind"
        defaultValue={mark?.kind ?? 'spur'}
        options={MARK_KINDS.map((k) => ({ value: k, label: markKindLabel(k) }))}
        error={errors.kind}
      />
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1.5 text-sm font-medium text-ink">Where</legend>
        <div className="flex gap-4 text-sm text-ink-soft">
          <label className="flex items-center gap-1.5">
            <input type="radio" name={`${id}-place`} checked={place === 'frequency'} onChange={() => setPlace('frequency')} />
            one frequency
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" name={`${id}-place`} checked={place === 'band'} onChange={() => setPlace('band')} />
            a band
          </label>
        </div>
        {place === 'frequency' ? (
          <TextField
            label="Frequency"
            name="frequencyHz"
            inputMode="decimal"
            unit="Hz"
            defaultValue={mark?.frequencyHz ?? ''}
            hint={bandHint}
            error={errors.frequencyHz}
          />
        ) : (
          <div className="flex flex-col gap-1.5">
            <div className="grid grid-cols-2 gap-2">
              <TextField label="From" name="loHz" inputMode="decimal" unit="Hz" defaultValue={mark?.bandHz?.[0] ?? ''} />
              <TextField label="To" name="hiHz" inputMode="decimal" unit="Hz" defaultValue={mark?.bandHz?.[1] ?? ''} />
            </div>
            {bandError ? (
              <p role="alert" className="text-xs leading-relaxed text-danger">
                {bandError}
              </p>
            ) : (
              bandHint && <p className="text-xs text-ink-faint">{bandHint}</p>
            )}
          </div>
        )}
      </fieldset>
      <TextAreaField
        label="Text"
        name="text"
        maxLength={MARK_TEXT_MAX}
        defaultValue={mark?.text ?? ''}
        placeholder="50 Hz mains pickup from the bench supply"
        className="min-h-[3.5rem]"
        error={errors.text}
      />
      <FormAlert message={server.formError} />
      <div className="flex items-center gap-3">
        <Button type="submit" size="sm" busy={busy} busyLabel="Saving…">
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="quiet" size="sm" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
