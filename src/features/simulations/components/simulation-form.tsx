/**
 * The simulator form: the rate-equation parameters with their defaults (an illustrative 1.55 µm MQW
 * Fabry–Perot laser, textbook-order values after Coldren, Corzine & Mašanović, 2nd ed. (2012) — from memory,
 * not verified; METHODS 6.4), the record (duration, sample rate, seed, integration step) and the laser the
 * synthetic capture is filed under. Only the parameters changed from their defaults are sent.
 */
import { useState, type FormEvent } from 'react';
import { DEFAULT_RATE_EQUATION_PARAMETERS, type RateEquationParameters } from '../../../../analysis/laser/rate-equation-model';
import { CreateSimulationRequest, type RateEquationParametersInput } from '../../../../server/contracts/simulations';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { errorsFromFailure, validateWith, type FieldErrors } from '../../../lib/form';
import { useCreateSimulation } from '../api/create-simulation';

type ScalarKey = Exclude<keyof RateEquationParameters, 'facetReflectivities'>;

const PARAMETERS: { key: ScalarKey; label: string; unit?: string }[] = [
  { key: 'currentMa', label: 'Drive current I', unit: 'mA' },
  { key: 'wavelengthNm', label: 'Wavelength λ', unit: 'nm' },
  { key: 'cavityLengthUm', label: 'Cavity length L', unit: 'µm' },
  { key: 'activeVolumeCm3', label: 'Active volume V', unit: 'cm³' },
  { key: 'confinementFactor', label: 'Confinement factor Γ' },
  { key: 'groupIndex', label: 'Group index n_g' },
  { key: 'internalLossPerCm', label: 'Internal loss α_i', unit: '/cm' },
  { key: 'gainCoefficientPerCm', label: 'Gain coefficient g₀', unit: '/cm' },
  { key: 'transparencyDensityCm3', label: 'Transparency density N_tr', unit: 'cm⁻³' },
  { key: 'gainShiftDensityCm3', label: 'Gain shift N_s', unit: 'cm⁻³' },
  { key: 'defectRecombinationPerS', label: 'Defect recombination A', unit: '/s' },
  { key: 'radiativeRecombinationCm3PerS', label: 'Radiative recombination B', unit: 'cm³/s' },
  { key: 'augerRecombinationCm6PerS', label: 'Auger recombination C', unit: 'cm⁶/s' },
  { key: 'spontaneousCoupling', label: 'Spontaneous-emission coupling β_sp' },
  { key: 'gainCompressionCm3', label: 'Gain compression ε', unit: 'cm³' },
  { key: 'injectionEfficiency', label: 'Injection efficiency η_i' },
  { key: 'alphaFactor', label: 'Linewidth enhancement α' },
];

const D = DEFAULT_RATE_EQUATION_PARAMETERS;
const FIELDS = ['durationS', 'sampleRateHz', 'seed', 'maxStepS', 'laserId', 'name', 'parameters'] as const;

function num(t: string, scale = 1): number | undefined {
  const s = t.trim().replace(',', '.');
  if (s === '') return undefined;
  const n = Number(s);
  return Number.isNaN(n) ? Number.NaN : n * scale;
}

/** 1.8e18 rather than 1800000000000000000: large and small defaults in exponent form, as typed in a notebook. */
function shown(v: number): string {
  const a = Math.abs(v);
  return a !== 0 && (a >= 1e6 || a < 1e-3) ? v.toExponential().replace('e+', 'e') : String(v);
}

export interface SimulationFormProps {
  benchId: string;
  lasers: readonly { id: string; name: string }[];
}

export function SimulationForm({ benchId, lasers }: SimulationFormProps) {
  const [params, setParams] = useState<Record<string, string>>(() => ({
    ...Object.fromEntries(PARAMETERS.map((p) => [p.key, shown(D[p.key])])),
    r1: String(D.facetReflectivities[0]),
    r2: String(D.facetReflectivities[1]),
  }));
  const [record, setRecord] = useState({ name: '', laserId: '', durationUs: '6.5536', sampleRateGhz: '10', seed: '1', stepPs: '1' });
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const create = useCreateSimulation(benchId);

  function submit(e: FormEvent) {
    e.preventDefault();
    const parameters: RateEquationParametersInput = {};
    for (const p of PARAMETERS) {
      const v = num(params[p.key]);
      if (v !== D[p.key]) (parameters as Record<string, number | undefined>)[p.key] = v;
    }
    const r: [number, number] = [num(params.r1) as number, num(params.r2) as number];
    if (r[0] !== D.facetReflectivities[0] || r[1] !== D.facetReflectivities[1]) parameters.facetReflectivities = r;
    const body = {
      ...(record.name.trim() ? { name: record.name.trim() } : {}),
      ...(record.laserId ? { laserId: record.laserId } : {}),
      parameters,
      durationS: num(record.durationUs, 1e-6),
      sampleRateHz: num(record.sampleRateGhz, 1e9),
      seed: num(record.seed),
      maxStepS: num(record.stepPs, 1e-12),
    };
    const checked = validateWith(CreateSimulationRequest, body);
    if (!checked.ok) {
      setFieldErrors(checked.fieldErrors);
      setFormError(null);
      return;
    }
    setFieldErrors({});
    setFormError(null);
    create.mutate(checked.data, {
      onError: (error) => {
        const f = errorsFromFailure(error, [...FIELDS, ...PARAMETERS.map((p) => `parameters.${p.key}`), 'parameters.facetReflectivities.0', 'parameters.facetReflectivities.1']);
        setFieldErrors(f.fieldErrors);
        setFormError(f.formError);
      },
    });
  }

  const setP = (key: string) => (e: { target: { value: string } }) => setParams({ ...params, [key]: e.target.value });
  const setR = (key: keyof typeof record) => (e: { target: { value: string } }) => setRecord({ ...record, [key]: e.target.value });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-6" aria-label="Rate-equation simulation">
      <fieldset className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-sm font-semibold text-ink">Record</legend>
        <TextField label="Name" name="name" value={record.name} onChange={setR('name')} aside="optional" error={fieldErrors.name} />
        <SelectField
          label="File under laser"
          name="laserId"
          value={record.laserId}
          onChange={setR('laserId')}
          options={[{ value: '', label: 'no laser' }, ...lasers.map((l) => ({ value: l.id, label: l.name }))]}
          error={fieldErrors.laserId}
        />
        <TextField label="Duration" name="durationUs" unit="µs" inputMode="decimal" value={record.durationUs} onChange={setR('durationUs')} error={fieldErrors.durationS} hint="duration × sample rate: 4096 to 2 097 152 samples" />
        <TextField label="Sample rate" name="sampleRateGhz" unit="GHz" inputMode="decimal" value={record.sampleRateGhz} onChange={setR('sampleRateGhz')} error={fieldErrors.sampleRateHz} />
        <TextField label="Seed" name="seed" inputMode="numeric" value={record.seed} onChange={setR('seed')} error={fieldErrors.seed} />
        <TextField label="Largest integration step" name="stepPs" unit="ps" inputMode="decimal" value={record.stepPs} onChange={setR('stepPs')} error={fieldErrors.maxStepS} />
      </fieldset>
      <fieldset className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <legend className="mb-1 text-sm font-semibold text-ink">Laser (single-mode rate equations)</legend>
        <p className="col-span-full -mt-1 text-xs leading-relaxed text-caution">
          Defaults: an illustrative 1.55 µm multi-quantum-well Fabry–Perot laser, textbook-order values after Coldren, Corzine &amp; Mašanović, “Diode
          Lasers and Photonic Integrated Circuits”, 2nd ed. (2012) — from memory, not verified against the book.
        </p>
        {PARAMETERS.map((p) => (
          <TextField key={p.key} label={p.label} name={p.key} unit={p.unit} inputMode="decimal" value={params[p.key]} onChange={setP(p.key)} error={fieldErrors[`parameters.${p.key}`]} />
        ))}
        <TextField label="Facet reflectivity R₁" name="r1" inputMode="decimal" value={params.r1} onChange={setP('r1')} error={fieldErrors['parameters.facetReflectivities.0'] ?? fieldErrors['parameters.facetReflectivities']} />
        <TextField label="Facet reflectivity R₂" name="r2" inputMode="decimal" value={params.r2} onChange={setP('r2')} error={fieldErrors['parameters.facetReflectivities.1']} />
      </fieldset>
      <FormAlert message={formError ?? (fieldErrors.parameters ? `Parameters: ${fieldErrors.parameters}` : null)} />
      <div>
        <Button type="submit" busy={create.isPending} busyLabel="Starting…">
          Run the simulation
        </Button>
      </div>
    </form>
  );
}
