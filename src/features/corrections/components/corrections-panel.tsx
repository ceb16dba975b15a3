/**
 * Corrections for how the capture was measured, beside its spectrum: subtract a reference laser of known
 * noise (another analysis on the bench, or its linewidth), or divide out an unbalanced interferometer of
 * delay τ with the notches near its zeros masked. Each correction is kept with the analysis and shows the
 * figures before and after, and the corrected spectrum with the masked bands hatched.
 */
import { useState, type FormEvent } from 'react';
import type { Correction, CorrectionFigures } from '../../../../server/contracts/corrections';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormAlert, LoadingNote } from '../../../components/ui/notes';
import { Quantity } from '../../../components/ui/quantity';
import { Section } from '../../../components/ui/section';
import { isApiError } from '../../../lib/api-client';
import { errorsFromFailure, formText, type FieldErrors } from '../../../lib/form';
import { formatScientific, formatSI } from '../../../lib/units';
import { useCreateCorrection } from '../api/create-correction';
import type { ReferenceChoice } from '../api/list-reference-analyses';
import { useDeleteCorrection } from '../api/delete-correction';
import { useCorrections } from '../api/list-corrections';
import { CorrectedSpectrumPlot } from './corrected-spectrum-plot';

type Kind = 'reference-linewidth' | 'reference-analysis' | 'delay-interferometer';

function FiguresRow({ label, f }: { label: string; f: CorrectionFigures }) {
  return (
    <tr className="border-b border-rule">
      <th scope="row" className="py-1.5 pr-4 text-left font-medium">
        {label}
      </th>
      <td className="py-1.5 pr-4">{f.whiteFloorHz2PerHz === null ? '—' : <Quantity q={formatScientific(f.whiteFloorHz2PerHz, 'Hz²/Hz', 3)} />}</td>
      <td className="py-1.5 pr-4">{f.intrinsicLinewidthHz === null ? '—' : <Quantity q={formatSI(f.intrinsicLinewidthHz, 'Hz', { significant: 4 })} />}</td>
      <td className="py-1.5">{f.betaLinewidthHz === null ? '—' : <Quantity q={formatSI(f.betaLinewidthHz, 'Hz', { significant: 4 })} />}</td>
    </tr>
  );
}

function describe(c: Correction, references: ReferenceChoice[]): string {
  if (c.type === 'delay-interferometer') return `Interferometer, τ = ${formatSI(Number(c.params.delayS), 's', { significant: 4 }).text}`;
  if (c.params.linewidthHz !== undefined) return `Reference linewidth ${formatSI(Number(c.params.linewidthHz), 'Hz', { significant: 4 }).text} subtracted`;
  const ref = references.find((r) => r.analysisId === c.params.referenceAnalysisId);
  return `Reference spectrum subtracted: ${ref?.label ?? String(c.params.referenceAnalysisId)}`;
}

function CorrectionCard({ c, references, canWrite, analysisId }: { c: Correction; references: ReferenceChoice[]; canWrite: boolean; analysisId: string }) {
  const remove = useDeleteCorrection(analysisId);
  return (
    <article className="rounded-[4px] border border-rule bg-paper-card px-5 py-4" data-testid="correction-card">
      <div className="flex items-start justify-between gap-4">
        <h3 className="font-semibold text-ink">{describe(c, references)}</h3>
        {canWrite && (
          <Button size="sm" variant="quiet" disabled={remove.isPending} onClick={() => remove.mutate(c.id)}>
            Remove
          </Button>
        )}
      </div>
      <table className="mt-3 w-full border-collapse text-[0.9375rem]" data-testid="correction-figures">
        <thead>
          <tr className="border-b border-rule-strong text-left text-xs tracking-wide text-ink-faint uppercase">
            <th scope="col" className="py-1.5 pr-4 font-medium" />
            <th scope="col" className="py-1.5 pr-4 font-medium">White floor</th>
            <th scope="col" className="py-1.5 pr-4 font-medium">Intrinsic linewidth</th>
            <th scope="col" className="py-1.5 font-medium normal-case">β-line linewidth</th>
          </tr>
        </thead>
        <tbody>
          <FiguresRow label="As measured" f={c.before} />
          <FiguresRow label="Corrected" f={c.figures} />
        </tbody>
      </table>
      {c.type === 'delay-interferometer' && (
        <p className="mt-3 text-sm text-ink-soft" data-testid="masked-summary">
          {c.maskedCount} bins masked in {c.maskedRangesHz.length} notch{c.maskedRangesHz.length === 1 ? '' : 'es'} near the zeros n/τ (first at{' '}
          <Quantity q={formatSI(c.firstZeroHz ?? Number.NaN, 'Hz', { significant: 4 })} />
          ); hatched on the plot.
        </p>
      )}
      {c.type === 'reference' && c.notPositiveCount + c.outsideReferenceCount > 0 && (
        <p className="mt-3 text-sm text-ink-soft">
          {c.notPositiveCount} bins went to or below zero and {c.outsideReferenceCount} lay outside the reference's band: left out.
        </p>
      )}
      <div className="mt-4">
        <CorrectedSpectrumPlot correction={c} />
      </div>
      {c.warnings.length > 0 && (
        <ul className="mt-3 list-disc pl-5 text-sm text-ink-soft">
          {c.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </article>
  );
}

export function CorrectionsPanel({ analysisId, done, canWrite, references }: { analysisId: string; done: boolean; canWrite: boolean; references: ReferenceChoice[] }) {
  const list = useCorrections(analysisId, done);
  const create = useCreateCorrection(analysisId);
  const [kind, setKind] = useState<Kind>('reference-linewidth');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const others = references.filter((r) => r.analysisId !== analysisId);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setFormError(null);
    setFieldErrors({});
    const data = new FormData(e.currentTarget);
    const num = (name: string) => {
      const t = formText(data, name).replace(',', '.').trim();
      return t === '' ? Number.NaN : Number(t);
    };
    const body =
      kind === 'reference-linewidth'
        ? { type: 'reference' as const, linewidthHz: num('linewidthKhz') * 1e3 }
        : kind === 'reference-analysis'
          ? { type: 'reference' as const, referenceAnalysisId: formText(data, 'referenceAnalysisId') }
          : { type: 'delay-interferometer' as const, delayS: num('delayUs') * 1e-6 };
    try {
      await create.mutateAsync(body);
    } catch (err) {
      const { fieldErrors: fe, formError: fm } = errorsFromFailure(err, ['linewidthHz', 'referenceAnalysisId', 'delayS']);
      setFieldErrors(fe);
      setFormError(fm);
    }
  }

  return (
    <Section
      id="corrections"
      title="Measurement corrections"
      lede="Subtract a reference laser of known noise, or divide out an unbalanced interferometer; the figures are read again from the corrected spectrum."
    >
      {!done ? (
        <p className="text-sm text-ink-faint">Available once the analysis is done.</p>
      ) : (
        <div className="space-y-6">
          {canWrite && (
            <form onSubmit={onSubmit} noValidate className="grid max-w-[40rem] gap-4" aria-label="Add a correction">
              <SelectField
                label="Correction"
                name="kind"
                value={kind}
                onChange={(e) => setKind(e.target.value as Kind)}
                options={[
                  { value: 'reference-linewidth', label: 'Reference laser, by its linewidth' },
                  { value: 'reference-analysis', label: 'Reference laser, by its analysis on this bench' },
                  { value: 'delay-interferometer', label: 'Unbalanced interferometer (delay τ)' },
                ]}
              />
              {kind === 'reference-linewidth' && (
                <TextField label="Reference linewidth (Lorentzian FWHM)" name="linewidthKhz" inputMode="decimal" unit="kHz" error={fieldErrors.linewidthHz} hint="Subtracted as the white level Δν/π." />
              )}
              {kind === 'reference-analysis' && (
                <SelectField
                  label="Reference analysis"
                  name="referenceAnalysisId"
                  error={fieldErrors.referenceAnalysisId}
                  options={others.length > 0 ? others.map((r) => ({ value: r.analysisId, label: r.label })) : [{ value: '', label: 'No other analysed capture on this bench' }]}
                />
              )}
              {kind === 'delay-interferometer' && (
                <TextField label="Delay τ" name="delayUs" inputMode="decimal" unit="µs" error={fieldErrors.delayS} hint="Bins where 4 sin²(πfτ) < 0.1 are masked." />
              )}
              <FormAlert message={formError} />
              <div>
                <Button type="submit" disabled={create.isPending}>
                  {create.isPending ? 'Correcting…' : 'Apply correction'}
                </Button>
              </div>
            </form>
          )}
          {list.isPending ? (
            <LoadingNote />
          ) : list.isError ? (
            <FormAlert message={isApiError(list.error) ? list.error.message : 'The corrections could not be loaded.'} />
          ) : list.data.corrections.length === 0 ? (
            <p className="text-sm text-ink-faint">No corrections yet.</p>
          ) : (
            list.data.corrections.map((c) => <CorrectionCard key={c.id} c={c} references={references} canWrite={canWrite} analysisId={analysisId} />)
          )}
        </div>
      )}
    </Section>
  );
}
