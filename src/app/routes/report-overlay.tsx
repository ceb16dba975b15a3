/**
 * /benches/:benchId/overlays/:overlayId/report — the printable report of an overlay, outside the
 * site chrome: a screen-only bar (back, print) over an A4 sheet. Combines the overlay and its plot
 * (overlays feature), each trace's capture and marks, and the product version.
 */
import type { QueryClient } from '@tanstack/react-query';
import { useSuspenseQueries } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { Button } from '../../components/ui/button';
import { paths } from '../../config/paths';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { captureQueryOptions } from '../../features/captures/api/get-capture';
import { marksQueryOptions } from '../../features/marks/api/list-marks';
import { overlayQueryOptions, useOverlay } from '../../features/overlays/api/get-overlay';
import { OverlayPlot } from '../../features/overlays/components/overlay-plot';
import { useVersion, versionQueryOptions } from '../../features/reports/api/get-version';
import { OverlayReport } from '../../features/reports/components/overlay-report';
import { requireUser } from './guards';

export const overlayReportLoader =
  (queryClient: QueryClient) =>
  async ({ params, request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const [, { overlay }] = await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(params.benchId ?? '')),
      queryClient.ensureQueryData(overlayQueryOptions(params.overlayId ?? '')),
      queryClient.ensureQueryData(versionQueryOptions()),
    ]);
    const captureIds = [...new Set(overlay.traces.map((t) => t.captureId))];
    await Promise.all(
      captureIds.flatMap((id) => [queryClient.ensureQueryData(captureQueryOptions(id)), queryClient.ensureQueryData(marksQueryOptions(id))]),
    );
    return null;
  };

export function OverlayReportRoute() {
  const { benchId = '', overlayId = '' } = useParams();
  const bench = useBench(benchId);
  const overlay = useOverlay(overlayId);
  const version = useVersion();
  const [printedAt] = useState(() => new Date());
  const captureIds = [...new Set(overlay.traces.map((t) => t.captureId))];
  const captureResults = useSuspenseQueries({ queries: captureIds.map((id) => captureQueryOptions(id)) });
  const marksResults = useSuspenseQueries({ queries: captureIds.map((id) => marksQueryOptions(id)) });
  const captures = Object.fromEntries(captureIds.map((id, i) => [id, captureResults[i].data.capture]));
  const marksByCapture = Object.fromEntries(captureIds.map((id, i) => [id, marksResults[i].data.marks]));

  let n = 0;
  const plotMarks = overlay.traces.flatMap((t) =>
    (marksByCapture[t.captureId] ?? []).map((m) => ({
      key: `${t.analysisId}-${m.id}`,
      loHz: m.bandHz ? m.bandHz[0] : (m.frequencyHz ?? 0),
      hiHz: m.bandHz ? m.bandHz[1] : null,
      label: `${++n} ${m.text}`,
    })),
  );
  const traces = overlay.traces.map((t, i) => ({
    key: t.analysisId,
    label: `${i + 1} ${t.laserName ? `${t.fileName} · ${t.laserName}` : t.fileName}`,
    color: t.color,
    frequencyHz: t.series?.frequencyHz ?? [],
    sNu: t.series?.frequencyNoiseHz2PerHz ?? [],
  }));

  return (
    <div className="report-backdrop min-h-screen bg-paper-deep pb-12">
      <title>{`Report · ${overlay.name} · Phaseloom`}</title>
      <div className="report-screen-only mx-auto flex w-[210mm] items-center justify-between gap-4 py-4">
        <Link to={paths.benches.overlay.getHref(benchId, overlayId)} className="text-sm text-accent hover:underline">
          ← Back to the overlay
        </Link>
        <div className="flex items-center gap-4">
          <span className="text-xs text-ink-faint">A4; choose “Save as PDF” in the print dialog for a file.</span>
          <Button size="sm" onClick={() => window.print()} data-testid="report-print">
            Print…
          </Button>
        </div>
      </div>
      <OverlayReport
        benchName={bench.name}
        overlay={overlay}
        captures={captures}
        marksByCapture={marksByCapture}
        plot={<OverlayPlot traces={traces} marks={plotMarks} label={`Frequency-noise spectra of the overlay ${overlay.name}`} height={340} />}
        version={version}
        printedAt={printedAt}
      />
    </div>
  );
}
