/**
 * Adds or edits a laser: name, type, a nominal wavelength or optical frequency (one of them; the
 * other is shown as it will be stored, ν = c/λ), and notes. Validated with the server's contracts.
 */
import { useId, useRef, useState, type FormEvent } from 'react';
import { frequencyThzToWavelengthNm, wavelengthNmToFrequencyThz } from '../../../../analysis/units';
import { CreateLaserRequest, LaserType, UpdateLaserRequest, type Laser } from '../../../../server/contracts/lasers';
import { Button } from '../../../components/ui/button';
import { cn } from '../../../components/ui/cn';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { DoneNote, FormAlert } from '../../../components/ui/notes';
import { Quantity } from '../../../components/ui/quantity';
import { errorsFromFailure, formNumber, formText, validateWith, type FieldErrors } from '../../../lib/form';
import { formatFrequencyThz, formatWavelengthNm } from '../../../lib/units';
import { useCreateLaser } from '../api/create-laser';
import { useUpdateLaser } from '../api/update-laser';
import { LASER_TYPE_LABELS } from './laser-type-labels';

type GivenAs = 'wavelength' | 'frequency';

const FIELDS = ['name', 'type', 'wavelengthNm', 'frequencyThz', 'notes'] as const;

const TYPE_OPTIONS = LaserType.options.map((t) => ({ value: t, label: LASER_TYPE_LABELS[t] }));

export interface LaserFormProps {
  benchId: string;
  /** the laser to edit; absent to add a new one */
  laser?: Laser;
  onDone?: (laser: Laser) => void;
  onCancel?: () => void;
  /** after a change that alters the bench's counts */
  onChanged?: () => void;
}

function initialText(value: number | null | undefined): string {
  return value == null ? '' : String(value);
}

export function LaserForm({ benchId, laser, onDone, onCancel, onChanged }: LaserFormProps) {
  const editing = laser !== undefined;
  const createLaser = useCreateLaser(benchId, { onChanged });
  const updateLaser = useUpdateLaser(benchId, { onChanged });
  const mutation = editing ? updateLaser : createLaser;
  const formRef = useRef<HTMLFormElement>(null);
  const groupId = useId();

  const [givenAs, setGivenAs] = useState<GivenAs>(laser && laser.wavelengthNm == null && laser.frequencyThz != null ? 'frequency' : 'wavelength');
  const [quantityText, setQuantityText] = useState(
    givenAs === 'frequency' ? initialText(laser?.frequencyThz) : initialText(laser?.wavelengthNm),
  );
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const quantityField = givenAs === 'wavelength' ? 'wavelengthNm' : 'frequencyThz';
  const parsedQuantity = Number(quantityText.trim().replace(',', '.'));
  const preview =
    quantityText.trim() !== '' && Number.isFinite(parsedQuantity) && parsedQuantity > 0
      ? givenAs === 'wavelength'
        ? formatFrequencyThz(wavelengthNmToFrequencyThz(parsedQuantity))
        : formatWavelengthNm(frequencyThzToWavelengthNm(parsedQuantity))
      : null;

  function switchGivenAs(next: GivenAs) {
    if (next === givenAs) return;
    // carry the value over, converted, so switching never loses what was typed
    if (preview) setQuantityText(preview.number);
    setGivenAs(next);
    setFieldErrors((e) => ({ ...e, wavelengthNm: undefined, frequencyThz: undefined }));
  }

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const name = formText(data, 'name');
    const type = formText(data, 'type');
    const notes = formText(data, 'notes');
    const quantity = formNumber(data, 'quantity');
    setFormError(null);
    setDone(null);
    if (quantity !== undefined && Number.isNaN(quantity)) {
      setFieldErrors({ [quantityField]: 'must be a number, e.g. 1550.12' });
      return;
    }
    const values = { name, type, notes, [quantityField]: editing ? (quantity ?? null) : quantity };
    const checked = editing ? validateWith(UpdateLaserRequest, values) : validateWith(CreateLaserRequest, values);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      return;
    }
    setFieldErrors({});
    const handlers = {
      onSuccess: ({ laser: saved }: { laser: Laser }) => {
        if (!editing) {
          formRef.current?.reset();
          setQuantityText('');
          setDone(`Added ${saved.name}.`);
        }
        onDone?.(saved);
      },
      onError: (error: Error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    };
    const parsedType = LaserType.parse(type);
    if (editing) {
      // giving one quantity sets both; clearing it (null) clears both
      const body = {
        name: name.trim(),
        type: parsedType,
        notes: notes.trim() === '' ? null : notes.trim(),
        [quantityField]: quantity ?? null,
      };
      updateLaser.mutate({ laserId: laser.id, body }, handlers);
    } else {
      const body = {
        name: name.trim(),
        type: parsedType,
        notes: notes.trim() || undefined,
        ...(quantity !== undefined ? { [quantityField]: quantity } : {}),
      };
      createLaser.mutate(body, handlers);
    }
  }

  const quantityError = fieldErrors.wavelengthNm ?? fieldErrors.frequencyThz;

  return (
    <form
      ref={formRef}
      noValidate
      onSubmit={onSubmit}
      aria-label={editing ? `Edit ${laser.name}` : 'Add a laser'}
      className="grid grid-cols-[minmax(0,1.2fr)_minmax(0,0.8fr)_minmax(0,1.1fr)] gap-x-6 gap-y-5"
    >
      <TextField
        label="Name"
        name="name"
        required
        defaultValue={laser?.name ?? ''}
        error={fieldErrors.name}
        placeholder={editing ? undefined : 'e.g. ECL-1550 serial 0042'}
      />
      <SelectField label="Type" name="type" defaultValue={laser?.type ?? 'dfb'} options={TYPE_OPTIONS} error={fieldErrors.type} />

      <fieldset className="flex min-w-0 flex-col gap-1.5">
        <legend className="sr-only">Nominal wavelength or optical frequency</legend>
        <div className="flex items-baseline justify-between gap-3">
          <label htmlFor={`${groupId}-q`} className="text-sm font-medium text-ink">
            {givenAs === 'wavelength' ? 'Wavelength' : 'Optical frequency'}
          </label>
          <div role="radiogroup" aria-label="Give the laser's" className="flex gap-0.5 text-xs">
            {(['wavelength', 'frequency'] as const).map((g) => (
              <label
                key={g}
                className={cn(
                  'cursor-pointer rounded-[3px] px-1.5 py-0.5 has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent',
                  givenAs === g ? 'bg-paper-deep font-medium text-ink' : 'text-ink-faint hover:text-ink',
                )}
              >
                <input
                  type="radio"
                  name="givenAs"
                  value={g}
                  checked={givenAs === g}
                  onChange={() => switchGivenAs(g)}
                  className="sr-only"
                />
                {g === 'wavelength' ? 'λ in nm' : 'ν in THz'}
              </label>
            ))}
          </div>
        </div>
        <div className="relative">
          <input
            id={`${groupId}-q`}
            name="quantity"
            inputMode="decimal"
            autoComplete="off"
            value={quantityText}
            onChange={(e) => setQuantityText(e.target.value)}
            aria-invalid={quantityError ? true : undefined}
            aria-describedby={`${groupId}-qhint`}
            placeholder={givenAs === 'wavelength' ? '1550.12' : '193.400'}
            className={cn(
              'h-10 w-full rounded-[3px] border bg-paper-card pr-14 pl-3 font-mono text-[0.9375rem] text-ink tabular-nums placeholder:text-ink-faint/70 hover:border-ink-faint focus:border-accent',
              quantityError ? 'border-danger' : 'border-rule-strong',
            )}
          />
          <span aria-hidden="true" className="pointer-events-none absolute inset-y-0 right-3 flex items-center font-mono text-sm text-ink-faint">
            {givenAs === 'wavelength' ? 'nm' : 'THz'}
          </span>
        </div>
        <p id={`${groupId}-qhint`} className={cn('text-xs leading-relaxed', quantityError ? 'text-danger' : 'text-ink-faint')}>
          {quantityError ? (
            quantityError.charAt(0).toUpperCase() + quantityError.slice(1) + (/[.!?]$/.test(quantityError) ? '' : '.')
          ) : preview ? (
            <>
              {givenAs === 'wavelength' ? 'ν = c/λ = ' : 'λ = c/ν = '}
              <Quantity q={preview} className="text-ink-soft" />
            </>
          ) : (
            'Optional. Vacuum wavelength; the other is computed.'
          )}
        </p>
      </fieldset>

      <TextAreaField
        label="Notes"
        name="notes"
        aside="optional"
        rows={2}
        fieldClassName="col-span-3"
        defaultValue={laser?.notes ?? ''}
        error={fieldErrors.notes}
        placeholder={editing ? undefined : 'Drive current, temperature, isolator, fibre pigtail…'}
      />

      <FormAlert message={formError} className="col-span-3" />
      <div className="col-span-3 flex items-center gap-3">
        <Button type="submit" busy={mutation.isPending} busyLabel="Saving…">
          {editing ? 'Save laser' : 'Add laser'}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel} disabled={mutation.isPending}>
            {editing ? 'Cancel' : 'Close'}
          </Button>
        )}
        <DoneNote message={done} className="ml-2" />
      </div>
    </form>
  );
}
