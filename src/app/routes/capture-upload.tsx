/** /benches/:benchId/captures/new — add a capture: file, preview, what the file cannot tell, upload and first analysis. */
import type { QueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { ButtonLink } from '../../components/ui/button';
import { EmptyNote } from '../../components/ui/notes';
import { paths } from '../../config/paths';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { CaptureUpload } from '../../features/captures/components/capture-upload';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import type { RouteHandle } from './app-layout';

/** the form carries the laser-safety caution itself, so the footer does not repeat it */
export const captureUploadHandle: RouteHandle = { laserSafety: false };

export const captureUploadLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([queryClient.ensureQueryData(benchQueryOptions(benchId)), queryClient.ensureQueryData(lasersQueryOptions(benchId))]);
    return null;
  };

export function CaptureUploadRoute() {
  const benchId = useParams().benchId ?? '';
  const bench = useBench(benchId);
  const lasers = useLasers(benchId);
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';
  const onAnalysed = useCallback((analysisId: string) => navigate(paths.benches.spectrum.getHref(benchId, analysisId)), [navigate, benchId]);
  const laserParam = search.get('laser');
  const defaultLaserId = laserParam && lasers.some((l) => l.id === laserParam) ? laserParam : undefined;

  return (
    <>
      <title>{`Upload a capture · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'Upload' },
        ]}
        title="Upload a capture"
        lede="A phase, IQ, beat-note or instantaneous-frequency record from the bench. Its first bytes are read here to show what the file says; after the upload the spectrum and linewidths are worked out on the server."
      />
      <div className="mt-8">
        {canWrite ? (
          <CaptureUpload benchId={bench.id} lasers={lasers} defaultLaserId={defaultLaserId} onAnalysed={onAnalysed} />
        ) : (
          <EmptyNote
            title="Viewers read captures but do not upload them."
            action={<ButtonLink to={paths.benches.home.getHref(bench.id)}>Back to the bench</ButtonLink>}
          >
            Ask an owner of “{bench.name}” to make you an analyst if you need to add captures.
          </EmptyNote>
        )}
      </div>
    </>
  );
}
