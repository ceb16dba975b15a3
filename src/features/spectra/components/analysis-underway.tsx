/**
 * What the spectrum page shows before there is a spectrum: the analysis waiting for a worker or
 * running (stage and percentage, refreshed every second), or failed (the engine's reason and a
 * retry for analysts and owners).
 */
import type { Analysis } from '../../../../server/contracts/analyses';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { isApiError } from '../../../lib/api-client';
import { formatIsoDateTime } from '../../../lib/dates';
import { useRetryAnalysis } from '../api/retry-analysis';

function sentence(text: string): string {
  const t = text.trim();
  const first = t.charAt(0).toUpperCase() + t.slice(1);
  return /[.!?)]$/.test(first) ? first : `${first}.`;
}

function stageText(stage: string): string {
  const s = stage.replace(/[-_]+/g, ' ').trim();
  return s ? s.charAt(0).toUpperCase() + s.slice(1) : '';
}

export function AnalysisUnderway({ analysis, canWrite }: { analysis: Analysis; canWrite: boolean }) {
  const retry = useRetryAnalysis(analysis.id);
  const pct = Math.round(analysis.progress * 100);
  if (analysis.status === 'failed') {
    return (
      <div role="alert" className="border-l-2 border-danger bg-danger-soft/50 py-5 pr-5 pl-6" data-testid="analysis-failed">
        <p className="font-medium text-danger">This analysis failed</p>
        <p className="mt-1 max-w-prose text-sm leading-relaxed text-ink-soft">
          {sentence(analysis.error ?? 'no reason was recorded')}
        </p>
        <p className="mt-1 max-w-prose text-sm leading-relaxed text-ink-soft">
          If the reason is in the capture (kind, sample rate, a damaged file), upload it again with what was wrong put right. If it was the
          server, run it again.
        </p>
        {canWrite && (
          <div className="mt-4 flex items-center gap-4">
            <Button variant="secondary" size="sm" busy={retry.isPending} busyLabel="Queuing…" onClick={() => retry.mutate()}>
              Run it again
            </Button>
          </div>
        )}
        {retry.isError && <FormAlert className="mt-3" message={isApiError(retry.error) ? retry.error.message : 'It could not be queued again.'} />}
      </div>
    );
  }
  const running = analysis.status === 'running';
  return (
    <div className="rounded-[4px] border border-rule bg-paper-card px-6 py-6" data-testid="analysis-underway">
      <div className="flex items-baseline justify-between gap-6">
        <p className="font-medium text-ink" role="status" aria-live="polite">
          {running ? `Analysing · ${stageText(analysis.stage)}` : 'Waiting for an analysis worker'}
        </p>
        {running && <Mono className="text-sm text-ink-soft">{pct} %</Mono>}
      </div>
      <div role="progressbar" aria-label="Analysis progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={running ? pct : undefined} className="mt-3 h-[3px] w-full overflow-hidden bg-rule">
        {running ? <div className="h-full bg-accent transition-[width] duration-500" style={{ width: `${pct}%` }} /> : <span className="loading-rule block !h-full !w-full" />}
      </div>
      <p className="mt-3 text-xs text-ink-faint">
        Queued <Mono>{formatIsoDateTime(analysis.createdAt)}</Mono>
        {analysis.startedAt && (
          <>
            {' '}
            · started <Mono>{formatIsoDateTime(analysis.startedAt)}</Mono>
          </>
        )}
        . This page updates itself; the spectrum appears when the analysis is done.
      </p>
    </div>
  );
}
