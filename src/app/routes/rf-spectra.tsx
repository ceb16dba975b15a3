/** /benches/:benchId/rf-spectra — the bench's RF beat spectra, and (for owners and analysts) the upload form. */
import type { QueryClient } from '@tanstack/react-query';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import { rfSpectraQueryOptions, useRfSpectra } from '../../features/rf-spectra/api/list-rf-spectra';
import { RfSpectrumList } from '../../features/rf-spectra/components/rf-spectrum-list';
import { RfUploadForm } from '../../features/rf-spectra/components/rf-upload-form';

export const rfSpectraLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(lasersQueryOptions(benchId)),
      queryClient.ensureQueryData(rfSpectraQueryOptions(benchId)),
    ]);
    return null;
  };

export function RfSpectraRoute() {
  const benchId = useParams().benchId ?? '';
  const bench = useBench(benchId);
  const lasers = useLasers(benchId);
  const spectra = useRfSpectra(benchId);
  const navigate = useNavigate();
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';
  return (
    <>
      <title>{`RF spectra · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'RF spectra' },
        ]}
        title="RF beat spectra"
        lede="Spectrum-analyser traces of a beat note, each fitted with a Lorentzian, a Gaussian and a Voigt line; the −20 dB width; in self-heterodyne mode, the laser linewidth."
      />
      <Section id="rf-list" className="mt-10" title="Spectra" lede="Newest first. Open one for its trace, fits and figures.">
        <RfSpectrumList benchId={bench.id} spectra={spectra} />
      </Section>
      {canWrite && (
        <Panel id="rf-upload" title="Upload a spectrum" className="mt-12">
          <RfUploadForm benchId={bench.id} lasers={lasers} onUploaded={(s) => navigate(paths.benches.rfSpectrum.getHref(bench.id, s.id))} />
        </Panel>
      )}
    </>
  );
}
