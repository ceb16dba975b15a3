/**
 * The Allan deviation of an analysed capture: the log-log plot with error bars and slope guides, what
 * it is of (fractional frequency with ν0, or the frequency in Hz), and a table of the points.
 */
import type { AllanResponse } from '../../../../server/contracts/stability';
import { ErrorNote, LoadingNote } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { Section } from '../../../components/ui/section';
import { isApiError } from '../../../lib/api-client';
import { formatScientific, formatSI } from '../../../lib/units';
import { useAllan } from '../api/get-allan';
import { AllanPlot, SLOPE_LABEL } from './allan-plot';

function fmt(v: number, allan: AllanResponse): string {
  return allan.basis === 'fractional' ? formatScientific(v, '', 3).text : formatSI(v, 'Hz', { significant: 3 }).text;
}

export function AllanSection({ analysisId, done }: { analysisId: string; done: boolean }) {
  const query = useAllan(analysisId, done);
  return (
    <Section
      id="allan"
      title="Allan deviation"
      lede="Overlapping estimator at octave-spaced τ (NIST SP 1065), with confidence intervals; dashed guides mark the noise type read from the slope (IEEE Std 1139)."
    >
      {!done ? (
        <p className="text-sm text-ink-faint">Shown once the analysis is done.</p>
      ) : query.isPending ? (
        <LoadingNote>Reading the capture for the Allan deviation…</LoadingNote>
      ) : query.isError ? (
        <ErrorNote message={isApiError(query.error) ? query.error.message : 'The Allan deviation could not be computed.'} onRetry={() => void query.refetch()} />
      ) : (
        <AllanBody allan={query.data} />
      )}
    </Section>
  );
}

function AllanBody({ allan }: { allan: AllanResponse }) {
  return (
    <div className="space-y-5" data-testid="allan-section">
      <p className="text-sm text-ink-soft" data-testid="allan-basis">
        {allan.basis === 'fractional' ? (
          <>
            Of the fractional frequency y = (ν − ν₀)/ν₀ with ν₀ = <Mono>{formatSI(allan.nu0Hz ?? Number.NaN, 'Hz', { significant: 7 }).text}</Mono> (the laser's nominal
            frequency).
          </>
        ) : (
          <>The capture's laser has no optical frequency, so this is the Allan deviation of the frequency itself, in Hz (not fractional).</>
        )}{' '}
        Intervals: {Math.round(allan.confidence * 1000) / 10} % (χ², the smallest power-law edf at each τ).
      </p>
      <AllanPlot allan={allan} />
      <table className="w-full border-collapse text-[0.9375rem]" data-testid="allan-table">
        <thead>
          <tr className="border-b border-rule-strong text-left text-xs tracking-wide text-ink-faint uppercase">
            <th scope="col" className="py-1.5 pr-4 font-medium normal-case">τ</th>
            <th scope="col" className="py-1.5 pr-4 font-medium normal-case">{allan.basis === 'fractional' ? 'σ_y(τ)' : 'σ_ν(τ)'}</th>
            <th scope="col" className="py-1.5 pr-4 font-medium">Interval</th>
            <th scope="col" className="py-1.5 pr-4 font-medium">edf</th>
            <th scope="col" className="py-1.5 font-medium">Slope reads as</th>
          </tr>
        </thead>
        <tbody>
          {allan.points.map((p) => (
            <tr key={p.tauS} className="border-b border-rule">
              <td className="py-1 pr-4 font-mono">{formatSI(p.tauS, 's', { significant: 3 }).text}</td>
              <td className="py-1 pr-4 font-mono">{fmt(p.deviation, allan)}</td>
              <td className="py-1 pr-4 font-mono text-ink-soft">
                {fmt(p.lower, allan)} … {fmt(p.upper, allan)}
              </td>
              <td className="py-1 pr-4 font-mono">{p.edf < 100 ? p.edf.toFixed(1) : Math.round(p.edf)}</td>
              <td className="py-1">{p.slopeClass ? SLOPE_LABEL[p.slopeClass] : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {allan.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-ink-soft">
          {allan.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
