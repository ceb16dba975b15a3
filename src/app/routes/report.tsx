/**
 * /benches/:benchId/spectra/:analysisId/report — the printable report of one spectrum, outside the
 * site chrome: a screen-only bar (back, print) over an A4 sheet that prints as shown (@media print
 * in features/reports). Combines the bench, the analysis and its series, the capture, its laser,
 * its marks and the product version.
 */
import type { QueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { Button } from '../../components/ui/button';
import { EmptyNote } from '../../components/ui/notes';
import { paths } from '../../config/paths';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { captureQueryOptions, useCapture } from '../../features/captures/api/get-capture';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import { marksQueryOptions, useMarks } from '../../features/marks/api/list-marks';
import { toPlotMarks } from '../../features/marks/components/mark-style';
import { versionQueryOptions, useVersion } from '../../features/reports/api/get-version';
import { SpectrumReport } from '../../features/reports/components/spectrum-report';
import { analysisQueryOptions, useAnalysis } from '../../features/spectra/api/get-analysis';
import { spectrumQueryOptions, useSpectrum } from '../../features/spectra/api/get-spectrum';
import { requireUser } from './guards';

export const reportLoader =
  (queryClient: QueryClient) =>
  async ({ params, request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const benchId = params.benchId ?? '';
    const analysisId = params.analysisId ?? '';
    const [, analysis] = await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(analysisQueryOptions(analysisId)),
      queryClient.ensureQueryData(lasersQueryOptions(benchId)),
      queryClient.ensureQueryData(versionQueryOptions()),
    ]);
    await Promise.all([
      queryClient.ensureQueryData(captureQueryOptions(analysis.captureId)),
      queryClient.ensureQueryData(marksQueryOptions(analysis.captureId)),
      analysis.status === 'done' ? queryClient.ensureQueryData(spectrumQueryOptions(analysisId)) : null,
    ]);
    return null;
  };

export function ReportRoute() {
  const { benchId = '', analysisId = '' } = useParams();
  const bench = useBench(benchId);
  const analysis = useAnalysis(analysisId);
  const spectrumHref = paths.benches.spectrum.getHref(benchId, analysisId);
  return (
    <div className="report-backdrop min-h-screen bg-paper-deep pb-12">
      <div className="report-screen-only mx-auto flex w-[210mm] items-center justify-between gap-4 py-4">
        <Link to={spectrumHref} className="text-sm text-accent hover:underline">
          ← Back to the spectrum
        </Link>
        {analysis.status === 'done' && (
          <div className="flex items-center gap-4">
            <span className="text-xs text-ink-faint">A4; choose “Save as PDF” in the print dialog for a file.</span>
            <Button size="sm" onClick={() => window.print()} data-testid="report-print">
              Print…
            </Button>
          </div>
        )}
      </div>
      {analysis.status === 'done' && analysis.result ? (
        <DoneReport benchName={bench.name} benchId={benchId} analysisId={analysisId} />
      ) : (
        <div className="mx-auto w-[180mm]">
          <EmptyNote title="This analysis has no spectrum to report yet">
            It is {analysis.status}. A report is there once the analysis is done; <Link to={spectrumHref}>go back to the spectrum</Link>.
          </EmptyNote>
        </div>
      )}
    </div>
  );
}

function DoneReport({ benchName, benchId, analysisId }: { benchName: string; benchId: string; analysisId: string }) {
  const analysis = useAnalysis(analysisId);
  const { capture } = useCapture(analysis.captureId);
  const lasers = useLasers(benchId);
  const { marks } = useMarks(analysis.captureId);
  const spectrum = useSpectrum(analysisId);
  const version = useVersion();
  const [printedAt] = useState(() => new Date());
  const laser = capture.laserId ? (lasers.find((l) => l.id === capture.laserId) ?? null) : null;
  const plotMarks = useMemo(() => toPlotMarks(marks), [marks]);
  const series = useMemo(
    () => ({ frequencyHz: spectrum.frequencyHz, sNu: spectrum.values.map((v) => (v === null ? Number.NaN : v)) }),
    [spectrum],
  );
  return (
    <>
      <title>{`Report · ${capture.fileName} · Phaseloom`}</title>
      <SpectrumReport
        benchName={benchName}
        laser={laser}
        capture={capture}
        analysis={analysis}
        series={series}
        marks={marks}
        plotMarks={plotMarks}
        version={version}
        printedAt={printedAt}
      />
    </>
  );
}
