/**
 * /benches/:benchId/spectra/:analysisId — one analysis of a capture: how the capture was taken, the
 * spectrum with its figures, settings and exports, and the capture's other analyses.
 */
import type { QueryClient } from '@tanstack/react-query';
import { useCallback, useMemo } from 'react';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { ButtonLink } from '../../components/ui/button';
import { paths } from '../../config/paths';
import { useSignedInUser } from '../../features/auth/api/get-me';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { captureQueryOptions, useCapture } from '../../features/captures/api/get-capture';
import { AnalysisHistory } from '../../features/captures/components/analysis-history';
import { CaptureFacts } from '../../features/captures/components/capture-facts';
import { DeleteCaptureControl } from '../../features/captures/components/delete-capture-control';
import { CorrectionsSection } from '../../features/corrections/components/corrections-section';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import { commentsQueryOptions } from '../../features/marks/api/list-comments';
import { marksQueryOptions, useMarks } from '../../features/marks/api/list-marks';
import { CommentThread } from '../../features/marks/components/comment-thread';
import { toPlotMarks } from '../../features/marks/components/mark-style';
import { MarksPanel } from '../../features/marks/components/marks-panel';
import { ShareControl } from '../../features/share-links/components/share-control';
import { analysisQueryOptions, useAnalysis } from '../../features/spectra/api/get-analysis';
import { SpectrumWorkspace } from '../../features/spectra/components/spectrum-workspace';
import { AllanSection } from '../../features/stability/components/allan-section';
import type { RouteHandle } from './app-layout';

export const spectrumHandle: RouteHandle = { laserSafety: true };

export const spectrumLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    const analysisId = params.analysisId ?? '';
    const [, analysis] = await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(analysisQueryOptions(analysisId)),
      queryClient.ensureQueryData(lasersQueryOptions(benchId)),
    ]);
    await Promise.all([
      queryClient.ensureQueryData(captureQueryOptions(analysis.captureId)),
      queryClient.ensureQueryData(marksQueryOptions(analysis.captureId)),
      queryClient.ensureQueryData(commentsQueryOptions(analysis.captureId)),
    ]);
    return null;
  };

export function SpectrumRoute() {
  const { benchId = '', analysisId = '' } = useParams();
  const bench = useBench(benchId);
  const analysis = useAnalysis(analysisId);
  const { capture, analyses } = useCapture(analysis.captureId);
  const lasers = useLasers(benchId);
  const { marks } = useMarks(analysis.captureId);
  const plotMarks = useMemo(() => toPlotMarks(marks), [marks]);
  const user = useSignedInUser();
  const navigate = useNavigate();
  const laser = capture.laserId ? (lasers.find((l) => l.id === capture.laserId) ?? null) : null;
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';
  const canDelete = bench.role === 'owner' || (bench.role === 'analyst' && capture.uploadedBy === user.id);
  const openAnalysis = useCallback((id: string) => navigate(paths.benches.spectrum.getHref(benchId, id)), [navigate, benchId]);
  // keep the list of analyses in step with the one on screen as it finishes
  const history = analyses.map((a) => (a.id === analysis.id ? { ...a, ...analysis } : a));
  if (!history.some((a) => a.id === analysis.id)) history.push(analysis);

  return (
    <>
      <title>{`${capture.fileName} · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          ...(laser ? [{ label: laser.name, to: paths.benches.laser.getHref(bench.id, laser.id) }] : []),
          { label: 'Spectrum' },
        ]}
        title={capture.fileName}
        meta={<CaptureFacts capture={capture} laserName={laser?.name ?? null} />}
        actions={
          <div className="flex items-center gap-3">
            {analysis.status === 'done' && (
              <ButtonLink size="sm" to={paths.benches.report.getHref(bench.id, analysis.id)} data-testid="print-report">
                Print report
              </ButtonLink>
            )}
            {analysis.status === 'done' && canWrite && (
              <ButtonLink size="sm" to={paths.benches.overlays.getHref(bench.id, analysis.id)} data-testid="add-to-overlay">
                Add to overlay
              </ButtonLink>
            )}
            {analysis.status === 'done' && canWrite && <ShareControl benchId={bench.id} target={{ kind: 'analysis', id: analysis.id }} />}
            {canDelete && <DeleteCaptureControl captureId={capture.id} fileName={capture.fileName} onDeleted={() => navigate(paths.benches.home.getHref(bench.id), { replace: true })} />}
          </div>
        }
      />
      <div className="mt-8">
        <SpectrumWorkspace
          analysisId={analysis.id}
          canWrite={canWrite}
          context={{ fileName: capture.fileName, laserName: laser?.name ?? null }}
          onOpenAnalysis={openAnalysis}
          marks={plotMarks}
          besidePlot={<MarksPanel captureId={capture.id} canWrite={canWrite} />}
        />
      </div>
      <div className="mt-12">
        <CorrectionsSection benchId={bench.id} analysisId={analysis.id} done={analysis.status === 'done'} canWrite={canWrite} />
      </div>
      <div className="mt-12">
        <AllanSection analysisId={analysis.id} done={analysis.status === 'done'} />
      </div>
      <div className="mt-12 max-w-[44rem]">
        <CommentThread captureId={capture.id} canWrite={canWrite} />
      </div>
      <div className="mt-12 max-w-[44rem]">
        <AnalysisHistory benchId={bench.id} analyses={history} currentId={analysis.id} />
      </div>
    </>
  );
}
