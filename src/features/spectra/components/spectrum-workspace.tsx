/**
 * The spectrum page's working area for one analysis: while it runs, its stage and percentage; once
 * done, the plot (view switch, movable white-floor band, β-line, model, spurs), the figures with
 * what they came from, the settings panel that runs a new analysis, and the exports.
 * The view is kept in the address (?view=phase) so a link shows what its sender saw.
 */
import { Suspense, useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { useSearchParams } from 'react-router';
import { lineshape as computeLineshape } from '../../../../analysis/linewidth/lineshape';
import type { Analysis, AnalysisSettings } from '../../../../server/contracts/analyses';
import { fileStem } from '../../../components/plots/plot-export';
import { bandMean, VIEW_INFO, VIEWS, type SpectrumView } from '../../../components/plots/spectrum-math';
import { SpectrumPlot, type PlotMark } from '../../../components/plots/spectrum-plot';
import { LoadingNote } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { isApiError } from '../../../lib/api-client';
import { formatFixed, formatSI } from '../../../lib/units';
import { useCreateAnalysis } from '../api/create-analysis';
import { useAnalysis } from '../api/get-analysis';
import { useSpectrum } from '../api/get-spectrum';
import { AnalysisUnderway } from './analysis-underway';
import { ExportMenu } from './export-menu';
import { FiguresPanel, type LineshapeDisplay } from './figures-panel';
import { readResult } from './result-fields';
import { SettingsPanel } from './settings-panel';
import { ViewSwitch } from './view-switch';

const WINDOW_NAMES: Record<string, string> = { hann: 'Hann', 'blackman-harris': 'Blackman–Harris', 'flat-top': 'flat-top' };

export interface SpectrumWorkspaceProps {
  analysisId: string;
  /** analysts and owners run analyses */
  canWrite: boolean;
  /** names for titles and exported files */
  context: { fileName?: string; laserName?: string | null };
  /** go to another analysis (a new one just queued) */
  onOpenAnalysis: (analysisId: string) => void;
  /** people's marks on the capture, drawn on the plot */
  marks?: readonly PlotMark[];
  /** shown beside the plot once the spectrum is there (the list of marks) */
  besidePlot?: ReactNode;
}

export function SpectrumWorkspace({ analysisId, canWrite, context, onOpenAnalysis, marks, besidePlot }: SpectrumWorkspaceProps) {
  const analysis = useAnalysis(analysisId);
  if (analysis.status !== 'done' || !analysis.result) {
    return <AnalysisUnderway analysis={analysis} canWrite={canWrite} />;
  }
  return (
    <Suspense fallback={<LoadingNote>Loading the spectrum…</LoadingNote>}>
      <DoneWorkspace key={analysis.id} analysis={analysis} canWrite={canWrite} context={context} onOpenAnalysis={onOpenAnalysis} marks={marks} besidePlot={besidePlot} />
    </Suspense>
  );
}

const sameBand = (a: readonly [number, number] | null, b: readonly [number, number] | null) =>
  a !== null && b !== null && Math.abs(a[0] / b[0] - 1) < 1e-9 && Math.abs(a[1] / b[1] - 1) < 1e-9;

/** three significant digits: what a person means by a band edge */
const round3 = (v: number) => Number(v.toPrecision(3));

function DoneWorkspace({ analysis, canWrite, context, onOpenAnalysis, marks, besidePlot }: Omit<SpectrumWorkspaceProps, 'analysisId'> & { analysis: Analysis }) {
  const spectrum = useSpectrum(analysis.id);
  const r = useMemo(() => readResult(analysis.result!), [analysis.result]);
  const [params, setParams] = useSearchParams();
  const viewParam = params.get('view');
  const view: SpectrumView = (VIEWS as readonly string[]).includes(viewParam ?? '') ? (viewParam as SpectrumView) : 'frequency';
  const setView = (v: SpectrumView) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (v === 'frequency') next.delete('view');
        else next.set('view', v);
        return next;
      },
      { replace: true, preventScrollReset: true },
    );

  const series = useMemo(
    () => ({ frequencyHz: spectrum.frequencyHz, sNu: spectrum.values.map((v) => (v === null ? Number.NaN : v)) }),
    [spectrum],
  );

  const analysisBand = r.floorBandHz;
  const [band, setBand] = useState<[number, number] | null>(analysisBand ? [analysisBand[0], analysisBand[1]] : null);
  const moved = band !== null && !sameBand(band, analysisBand);
  const estimate = useMemo(() => (band ? bandMean(series, band) : null), [series, band]);

  // the small lineshape plot: the engine's lineshape over the displayed series (off the first paint)
  const [shape, setShape] = useState<LineshapeDisplay | null | 'computing'>('computing');
  useEffect(() => {
    const timer = setTimeout(() => {
      try {
        const f: number[] = [];
        const s: number[] = [];
        series.frequencyHz.forEach((x, i) => {
          if (x > 0 && Number.isFinite(series.sNu[i])) {
            f.push(x);
            s.push(series.sNu[i]);
          }
        });
        const out = computeLineshape(
          { frequencyHz: Float64Array.from(f), psd: Float64Array.from(s) },
          { observationTimeS: r.beta.observationTimeS, tailLevelHz2PerHz: r.floorHz2PerHz ?? undefined, displayPoints: 97, displaySpanFwhm: 3 },
        );
        setShape({ offsetHz: Array.from(out.offsetHz), power: Array.from(out.power), fwhmHz: out.fwhmHz });
      } catch {
        setShape(null);
      }
    }, 30);
    return () => clearTimeout(timer);
  }, [series, r.beta.observationTimeS, r.floorHz2PerHz]);

  const create = useCreateAnalysis(analysis.captureId, { onCreated: onOpenAnalysis });
  const run = useCallback((settings: AnalysisSettings) => create.mutate(settings), [create]);
  const runError = create.isError ? (isApiError(create.error) ? create.error.message : 'The analysis could not be queued.') : null;

  const svgRef = useRef<SVGSVGElement>(null);
  const info = VIEW_INFO[view];
  const stem = fileStem((context.fileName ?? 'spectrum').replace(/\.[a-z0-9]+$/i, ''), analysis.id.slice(0, 8), view === 'frequency' ? null : view);
  const s = r.settings;
  const t0 = r.beta.observationTimeS;

  return (
    <div className="flex flex-col gap-8" data-testid="spectrum-workspace">
      <div className={besidePlot ? 'grid grid-cols-[minmax(0,1fr)_17rem] gap-8' : undefined}>
        <div className="min-w-0">
          <div className="mb-3 flex flex-wrap items-center justify-between gap-4">
            <ViewSwitch view={view} onChange={setView} />
            <ExportMenu analysis={analysis} svgRef={svgRef} stem={stem} plotTitle={`${context.fileName ?? 'Spectrum'} — ${info.name} (${info.unit})`} context={context} />
          </div>
          <SpectrumPlot
            key={analysis.id}
            series={series}
            view={view}
            band={band}
            onBandChange={setBand}
            floorHz2PerHz={moved ? (estimate?.meanHz2PerHz ?? null) : r.floorHz2PerHz}
            observationTimeS={t0}
            model={r.model ? { ...r.model, bandHz: r.model.bandHz ?? [series.frequencyHz[0] ?? 1, series.frequencyHz[series.frequencyHz.length - 1] ?? 10] } : null}
            spurs={r.spurs}
            marks={marks}
            label={`${context.fileName ?? 'Capture'}: ${info.name}`}
            svgRef={svgRef}
          />
        </div>
        {besidePlot && <div className="min-w-0">{besidePlot}</div>}
      </div>

      <div className="grid grid-cols-[minmax(0,1fr)_17rem] gap-12">
        <section aria-labelledby="figures-heading" className="min-w-0">
          <div className="mb-4 flex items-baseline justify-between gap-4 border-b border-rule pb-2.5">
            <h2 id="figures-heading" className="text-lg font-semibold tracking-tight text-ink">
              Figures
            </h2>
            <p className="text-xs text-ink-faint" data-testid="figures-settings">
              {WINDOW_NAMES[s.window] ?? s.window} window · <Mono>{s.segment.toLocaleString('en-GB')}</Mono>-sample segments · <Mono>{formatFixed(s.overlap * 100, '%', 0).text}</Mono> overlap ·{' '}
              <Mono>{s.averages.toLocaleString('en-GB')}</Mono> averages · T₀ <Mono>{formatSI(t0, 's').text}</Mono>
            </p>
          </div>
          <FiguresPanel
            r={r}
            bandGiven={Boolean(analysis.settings.floorBandHz)}
            movedBand={moved ? band : null}
            movedEstimate={moved ? estimate : null}
            onResetBand={() => setBand(analysisBand ? [analysisBand[0], analysisBand[1]] : null)}
            onRunWithBand={() => band && run({ ...analysis.settings, floorBandHz: [round3(band[0]), round3(band[1])] })}
            onRunWithObservationTime={(seconds) => run({ ...analysis.settings, observationTimeS: seconds })}
            canWrite={canWrite}
            running={create.isPending}
            lineshape={shape}
          />
          {runError && (
            <p role="alert" className="mt-4 text-sm text-danger">
              {runError}
            </p>
          )}
        </section>
        <aside aria-labelledby="settings-heading" className="min-w-0">
          <h2 id="settings-heading" className="mb-4 border-b border-rule pb-2.5 text-lg font-semibold tracking-tight text-ink">
            Settings
          </h2>
          <SettingsPanel r={r} requested={analysis.settings} canWrite={canWrite} running={create.isPending} error={runError} onRun={run} />
        </aside>
      </div>
    </div>
  );
}
