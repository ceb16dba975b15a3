/**
 * The link-budget form: format, symbol rate, the lasers (one combined linewidth, or transmitter and local
 * oscillator each as a linewidth or a spectrum on the bench) and the carrier-recovery estimator. Checked
 * with the server's own contract before it is sent; the server's field messages come back beside the
 * fields they name.
 */
import type { FormEvent } from 'react';
import { EvaluateLinkBudgetRequest, MODULATION_FORMATS, type ModulationFormat } from '../../../../server/contracts/link-budgets';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { validateWith, type FieldErrors } from '../../../lib/form';
import type { BudgetFormValues, LaserFields, LaserMode, RecoveryKind } from './budget-form-state';
import { requestFromValues } from './budget-form-state';

/** A spectrum the lasers may be taken from: a done analysis on the bench. */
export interface SpectrumChoice {
  analysisId: string;
  label: string;
}

export interface LinkBudgetFormProps {
  values: BudgetFormValues;
  onChange: (values: BudgetFormValues) => void;
  spectra: readonly SpectrumChoice[];
  fieldErrors: FieldErrors;
  formError: string | null;
  busy: boolean;
  onValidated: (request: EvaluateLinkBudgetRequest) => void;
  onInvalid: (errors: FieldErrors) => void;
}

const FORMAT_NOTES: Record<ModulationFormat, string> = {
  QPSK: 'QPSK',
  '8PSK': '8PSK — no verified published tolerance',
  '16QAM': '16QAM',
  '32QAM': '32QAM — no verified published tolerance',
  '64QAM': '64QAM',
};

function LaserSourceFields({
  name,
  title,
  fields,
  spectra,
  errors,
  onChange,
}: {
  name: 'transmitter' | 'localOscillator';
  title: string;
  fields: LaserFields;
  spectra: readonly SpectrumChoice[];
  errors: FieldErrors;
  onChange: (fields: LaserFields) => void;
}) {
  return (
    <fieldset className="flex flex-col gap-3 border-l-2 border-rule pl-4">
      <legend className="mb-2 text-sm font-semibold text-ink">{title}</legend>
      <SelectField
        label="Noise from"
        name={`${name}-source`}
        value={fields.analysisId}
        onChange={(e) => onChange({ ...fields, analysisId: e.target.value })}
        options={[{ value: '', label: 'a Lorentzian linewidth' }, ...spectra.map((s) => ({ value: s.analysisId, label: `spectrum: ${s.label}` }))]}
        hint={spectra.length === 0 ? 'No analysed captures on this bench yet: give a linewidth.' : 'A measured S_ν is used as it is; low-frequency noise the estimator tracks does not count.'}
        error={errors[`${name}.analysisId`]}
      />
      {fields.analysisId === '' && (
        <TextField
          label="Linewidth (FWHM)"
          name={`${name}-linewidth`}
          inputMode="decimal"
          unit="kHz"
          value={fields.linewidthKhz}
          onChange={(e) => onChange({ ...fields, linewidthKhz: e.target.value })}
          error={errors[`${name}.linewidthHz`] ?? errors[name]}
        />
      )}
    </fieldset>
  );
}

export function LinkBudgetForm({ values, onChange, spectra, fieldErrors, formError, busy, onValidated, onInvalid }: LinkBudgetFormProps) {
  const set = <K extends keyof BudgetFormValues>(key: K, value: BudgetFormValues[K]) => onChange({ ...values, [key]: value });

  function submit(e: FormEvent) {
    e.preventDefault();
    const checked = validateWith(EvaluateLinkBudgetRequest, requestFromValues(values));
    if (!checked.ok) onInvalid(checked.fieldErrors);
    else onValidated(checked.data);
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5" aria-label="Link budget">
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <SelectField
          label="Modulation format"
          name="format"
          value={values.format}
          onChange={(e) => set('format', e.target.value as ModulationFormat)}
          options={MODULATION_FORMATS.map((f) => ({ value: f, label: FORMAT_NOTES[f] }))}
          error={fieldErrors.format}
        />
        <TextField
          label="Symbol rate"
          name="symbolRate"
          inputMode="decimal"
          unit="GBd"
          value={values.symbolRateGbd}
          onChange={(e) => set('symbolRateGbd', e.target.value)}
          error={fieldErrors.symbolRateBaud}
        />
      </div>

      <SelectField
        label="Lasers"
        name="mode"
        value={values.mode}
        onChange={(e) => set('mode', e.target.value as LaserMode)}
        options={[
          { value: 'pair', label: 'transmitter and local oscillator, each' },
          { value: 'combined', label: 'one combined linewidth (Tx + LO)' },
        ]}
      />
      {values.mode === 'combined' ? (
        <TextField
          label="Combined linewidth Δν_Tx + Δν_LO"
          name="combinedLinewidth"
          inputMode="decimal"
          unit="kHz"
          value={values.combinedKhz}
          onChange={(e) => set('combinedKhz', e.target.value)}
          error={fieldErrors.linewidthHz}
        />
      ) : (
        <div className="grid grid-cols-1 gap-5">
          <LaserSourceFields name="transmitter" title="Transmitter" fields={values.transmitter} spectra={spectra} errors={fieldErrors} onChange={(f) => set('transmitter', f)} />
          <LaserSourceFields
            name="localOscillator"
            title="Local oscillator"
            fields={values.localOscillator}
            spectra={spectra}
            errors={fieldErrors}
            onChange={(f) => set('localOscillator', f)}
          />
        </div>
      )}

      <div className="grid grid-cols-1 gap-4">
        <SelectField
          label="Carrier recovery"
          name="recovery"
          value={values.recovery}
          onChange={(e) => set('recovery', e.target.value as RecoveryKind)}
          options={[
            { value: 'none', label: 'not modelled (tolerance check only)' },
            { value: 'block-average', label: 'feed-forward block estimator' },
            { value: 'first-order-loop', label: 'first-order tracking loop' },
          ]}
          hint="Needed when a laser is given as a spectrum; it gives the residual phase error."
          error={fieldErrors.carrierRecovery}
        />
        {values.recovery === 'block-average' && (
          <TextField
            label="Block length M (odd)"
            name="blockLength"
            inputMode="numeric"
            unit="symbols"
            value={values.blockLength}
            onChange={(e) => set('blockLength', e.target.value)}
            error={fieldErrors['carrierRecovery.blockLength']}
          />
        )}
        {values.recovery === 'first-order-loop' && (
          <TextField
            label="Loop bandwidth f_c"
            name="loopBandwidth"
            inputMode="decimal"
            unit="MHz"
            value={values.loopBandwidthMhz}
            onChange={(e) => set('loopBandwidthMhz', e.target.value)}
            error={fieldErrors['carrierRecovery.bandwidthHz']}
          />
        )}
      </div>

      <FormAlert message={formError} />
      <div>
        <Button type="submit" busy={busy} busyLabel="Evaluating…">
          Evaluate the budget
        </Button>
      </div>
    </form>
  );
}
