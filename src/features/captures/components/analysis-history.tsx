/** The analyses of one capture, newest first, each with its settings and figures; the one on screen marked. */
import { Link } from 'react-router';
import type { AnalysisSummary } from '../../../../server/contracts/analyses';
import { cn } from '../../../components/ui/cn';
import { Mono } from '../../../components/ui/quantity';
import { paths } from '../../../config/paths';
import { formatIsoDateTime } from '../../../lib/dates';
import { formatSI } from '../../../lib/units';

function settingsText(a: AnalysisSummary): string {
  const s = a.settings;
  const parts: string[] = [];
  if (s.window) parts.push(s.window);
  if (s.segment) parts.push(`L ${s.segment}`);
  if (s.overlap !== undefined) parts.push(`${Math.round(s.overlap * 100)} %`);
  if (s.observationTimeS) parts.push(`T₀ ${formatSI(s.observationTimeS, 's').text}`);
  if (s.floorBandHz) parts.push(`band ${formatSI(s.floorBandHz[0], 'Hz').text}–${formatSI(s.floorBandHz[1], 'Hz').text}`);
  return parts.length ? parts.join(' · ') : 'engine defaults';
}

export function AnalysisHistory({ benchId, analyses, currentId }: { benchId: string; analyses: readonly AnalysisSummary[]; currentId: string }) {
  if (analyses.length <= 1) return null;
  const sorted = [...analyses].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return (
    <nav aria-label="Analyses of this capture" data-testid="analysis-history">
      <h2 className="mb-2 text-xs font-semibold tracking-[0.08em] text-ink-soft uppercase">Analyses of this capture · {analyses.length}</h2>
      <ol className="flex flex-col text-sm">
        {sorted.map((a) => {
          const current = a.id === currentId;
          return (
            <li key={a.id} className={cn('border-b border-rule/70 py-1.5', current && 'font-medium')}>
              <Link
                to={paths.benches.spectrum.getHref(benchId, a.id)}
                aria-current={current ? 'page' : undefined}
                className={cn('flex flex-wrap items-baseline justify-between gap-x-4 underline-offset-4 hover:underline', current ? 'text-ink' : 'text-accent')}
              >
                <span>
                  <Mono className="text-xs text-ink-faint">{formatIsoDateTime(a.createdAt)}</Mono> {settingsText(a)}
                </span>
                <span className="font-mono text-xs text-ink-soft">
                  {a.status === 'done' ? formatSI(a.intrinsicLinewidthHz ?? Number.NaN, 'Hz').text : a.status}
                </span>
              </Link>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
