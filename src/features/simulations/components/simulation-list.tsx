/** The bench's simulation runs: progress while they run, the prediction beside each, and the synthetic capture's spectrum once stored. */
import type { Simulation } from '../../../../server/contracts/simulations';
import { ButtonLink } from '../../../components/ui/button';
import { EmptyNote } from '../../../components/ui/notes';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { paths } from '../../../config/paths';
import { formatIsoDateTime } from '../../../lib/dates';
import { formatSI } from '../../../lib/units';

/** +2.5 %, −13 % */
function formatDeviation(r: number): string {
  const pct = (r * 100).toFixed(Math.abs(r) < 0.1 ? 1 : 0);
  return `${r < 0 ? '\u2212' : '+'}${pct.replace('-', '')} %`;
}

const STAGE: Record<string, string> = { queued: 'waiting for a worker', simulating: 'integrating the rate equations', storing: 'storing the capture', done: 'done', failed: 'failed' };

export function SimulationList({ benchId, simulations }: { benchId: string; simulations: readonly Simulation[] }) {
  if (simulations.length === 0) return <EmptyNote title="No simulations on this bench yet.">Runs appear here with their progress, then their synthetic capture.</EmptyNote>;
  return (
    <ul className="divide-y divide-rule border-y border-rule" aria-label="Simulations">
      {simulations.map((s) => (
        <li key={s.id} className="flex flex-col gap-2 py-3">
          <div className="flex flex-wrap items-baseline justify-between gap-3">
            <p className="font-medium text-ink">{s.name}</p>
            <span className="text-xs text-ink-faint">
              <Mono>{formatIsoDateTime(s.createdAt)}</Mono> · seed <Mono>{s.seed}</Mono> · <Mono>{s.samples}</Mono> samples at <Quantity q={formatSI(s.sampleRateHz, 'Hz')} />
            </span>
          </div>
          {(s.status === 'queued' || s.status === 'running') && (
            <div className="flex items-center gap-3" role="status">
              <progress max={1} value={s.progress} className="h-2 w-48 accent-accent" aria-label={`${s.name}: ${Math.round(s.progress * 100)} %`} />
              <span className="text-sm text-ink-soft">
                {STAGE[s.stage] ?? s.stage} · <Mono>{Math.round(s.progress * 100)} %</Mono>
              </span>
            </div>
          )}
          {s.status === 'failed' && <p className="text-sm text-danger">{s.error}</p>}
          {s.prediction && (
            <p className="text-sm text-ink-soft">
              Predicted: threshold <Quantity q={formatSI(s.prediction.thresholdCurrentMa * 1e-3, 'A')} />, output <Quantity q={formatSI(s.prediction.outputPowerMw * 1e-3, 'W')} />, intrinsic
              linewidth R_sp(1 + α²)/(4πP) = <Quantity q={formatSI(s.prediction.predictedLinewidthHz, 'Hz')} /> (n_sp = <Mono>{s.prediction.equivalentNsp.toFixed(2)}</Mono>)
            </p>
          )}
          {s.analysis && (s.analysis.status === 'queued' || s.analysis.status === 'running') && (
            <div className="flex items-center gap-3" role="status">
              <progress max={1} value={s.analysis.progress} className="h-2 w-48 accent-accent" aria-label={`analysis of ${s.name}: ${Math.round(s.analysis.progress * 100)} %`} />
              <span className="text-sm text-ink-soft">
                analysing the synthetic capture · <Mono>{Math.round(s.analysis.progress * 100)} %</Mono>
              </span>
            </div>
          )}
          {s.analysis?.status === 'failed' && <p className="text-sm text-danger">The analysis of the synthetic capture failed; open it for the reason.</p>}
          {s.analysis?.intrinsicLinewidthHz != null && s.prediction && (
            <p className="text-sm text-ink" data-testid="simulation-analysed">
              Analysed intrinsic linewidth <Quantity q={formatSI(s.analysis.intrinsicLinewidthHz, 'Hz')} /> —{' '}
              <Mono>{formatDeviation(s.analysis.intrinsicLinewidthHz / s.prediction.predictedLinewidthHz - 1)}</Mono> from the prediction
            </p>
          )}
          {s.status === 'done' && s.analysisId && (
            <div>
              <ButtonLink size="sm" to={paths.benches.spectrum.getHref(benchId, s.analysisId)}>
                Open the synthetic capture’s spectrum
              </ButtonLink>
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
