/**
 * The laser-estimator form: a Fabry–Perot description of the laser. Starting values are typical of a
 * 1.55 µm semiconductor laser; n_sp and α are marked "from memory" (METHODS 6.2: order of magnitude only).
 * Checked with the server's own contract; the server's field messages come back beside the fields.
 */
import { useState, type FormEvent } from 'react';
import { LaserEstimateRequest } from '../../../../server/contracts/laser-estimates';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { validateWith, type FieldErrors } from '../../../lib/form';

export interface EstimatorFormProps {
  wavelengthNm: number | null;
  busy: boolean;
  fieldErrors: FieldErrors;
  formError: string | null;
  onValidated: (request: LaserEstimateRequest) => void;
  onInvalid: (errors: FieldErrors) => void;
}

const num = (t: string) => {
  const s = t.trim().replace(',', '.');
  return s === '' ? undefined : Number(s);
};

export function EstimatorForm({ wavelengthNm, busy, fieldErrors, formError, onValidated, onInvalid }: EstimatorFormProps) {
  const [v, setV] = useState({
    wavelengthNm: wavelengthNm ? String(wavelengthNm) : '1550',
    groupIndex: '3.6',
    cavityLengthUm: '400',
    r1: '0.3',
    r2: '0.3',
    internalLossPerCm: '10',
    nsp: '2',
    alphaFactor: '4',
    outputPowerMw: '1',
  });
  const field = (key: keyof typeof v) => ({ value: v[key], onChange: (e: { target: { value: string } }) => setV({ ...v, [key]: e.target.value }), name: key });

  function submit(e: FormEvent) {
    e.preventDefault();
    const checked = validateWith(LaserEstimateRequest, {
      wavelengthNm: num(v.wavelengthNm),
      groupIndex: num(v.groupIndex),
      cavityLengthUm: num(v.cavityLengthUm),
      facetReflectivities: [num(v.r1), num(v.r2)],
      internalLossPerCm: num(v.internalLossPerCm),
      nsp: num(v.nsp),
      alphaFactor: num(v.alphaFactor),
      outputPowerMw: num(v.outputPowerMw),
    });
    if (checked.ok) onValidated(checked.data);
    else onInvalid(checked.fieldErrors);
  }

  const facetError = fieldErrors['facetReflectivities.0'] ?? fieldErrors['facetReflectivities.1'] ?? fieldErrors.facetReflectivities;
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label="Laser estimator">
      <div className="grid grid-cols-2 gap-4">
        <TextField label="Wavelength λ" unit="nm" inputMode="decimal" {...field('wavelengthNm')} error={fieldErrors.wavelengthNm} />
        <TextField label="Group index n_g" inputMode="decimal" {...field('groupIndex')} error={fieldErrors.groupIndex} />
        <TextField label="Cavity length L" unit="µm" inputMode="decimal" {...field('cavityLengthUm')} error={fieldErrors.cavityLengthUm} />
        <TextField label="Internal loss α_i" unit="/cm" inputMode="decimal" {...field('internalLossPerCm')} error={fieldErrors.internalLossPerCm} />
        <TextField label="Output facet R₁" inputMode="decimal" {...field('r1')} error={fieldErrors['facetReflectivities.0'] ?? facetError} hint="power reflectivity, in (0, 1)" />
        <TextField label="Back facet R₂" inputMode="decimal" {...field('r2')} error={fieldErrors['facetReflectivities.1']} hint="power reflectivity, in (0, 1)" />
        <TextField label="Inversion factor n_sp" inputMode="decimal" {...field('nsp')} error={fieldErrors.nsp} hint="typical 1.5–2.5 (from memory)" />
        <TextField label="α-factor" inputMode="decimal" {...field('alphaFactor')} error={fieldErrors.alphaFactor} hint="typical 2–7 (from memory)" />
        <TextField
          label="Power out of facet 1"
          unit="mW"
          inputMode="decimal"
          {...field('outputPowerMw')}
          error={fieldErrors.outputPowerMw}
          hint="the power leaving the output facet (R₁), not the total of both facets"
          fieldClassName="col-span-2"
        />
      </div>
      <FormAlert message={formError} />
      <div>
        <Button type="submit" busy={busy} busyLabel="Estimating…">
          Estimate the linewidth
        </Button>
      </div>
    </form>
  );
}
