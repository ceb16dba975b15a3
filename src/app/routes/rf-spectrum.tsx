/** /benches/:benchId/rf-spectra/:rfSpectrumId — one RF beat spectrum: the trace with its three fits, and the figures. */
import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { Button } from '../../components/ui/button';
import { Mono, Quantity } from '../../components/ui/quantity';
import { Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { formatIsoDateTime } from '../../lib/dates';
import { formatSI } from '../../lib/units';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { useSignedInUser } from '../../features/auth/api/get-me';
import { rfSpectrumQueryOptions, useRfSpectrum } from '../../features/rf-spectra/api/get-rf-spectrum';
import { DeleteRfSpectrumControl } from '../../features/rf-spectra/components/delete-rf-spectrum-control';
import { RfFitPlot, type RfScale } from '../../features/rf-spectra/components/rf-fit-plot';
import { RfFitTable } from '../../features/rf-spectra/components/rf-fit-table';

export const rfSpectrumLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(params.benchId ?? '')),
      queryClient.ensureQueryData(rfSpectrumQueryOptions(params.rfSpectrumId ?? '')),
    ]);
    return null;
  };

export function RfSpectrumRoute() {
  const { benchId = '', rfSpectrumId = '' } = useParams();
  const bench = useBench(benchId);
  const spectrum = useRfSpectrum(rfSpectrumId);
  const me = useSignedInUser();
  const navigate = useNavigate();
  const [scale, setScale] = useState<RfScale>('db');
  const mayDelete = bench.role === 'owner' || (bench.role === 'analyst' && spectrum.createdBy === me.id);
  const best = spectrum.result.fits.find((f) => f.shape === spectrum.result.bestShape);

  return (
    <>
      <title>{`${spectrum.name} · RF spectra · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'RF spectra', to: paths.benches.rfSpectra.getHref(bench.id) },
          { label: spectrum.name },
        ]}
        title={spectrum.name}
        meta={
          <>
            <span>
              <span className="text-ink-faint">file</span> <Mono>{spectrum.fileName}</Mono>
            </span>
            <span>
              <span className="text-ink-faint">measurement</span> {spectrum.mode === 'beat' ? 'beat of two lasers' : 'delayed self-heterodyne'}
            </span>
            <span>
              <span className="text-ink-faint">points</span> <Mono>{spectrum.points}</Mono>
            </span>
            {best?.fwhmHz != null && (
              <span>
                <span className="text-ink-faint">best fit</span> {spectrum.result.bestShape} <Quantity q={formatSI(best.fwhmHz, 'Hz', { significant: 4 })} />
              </span>
            )}
            <span>
              <span className="text-ink-faint">uploaded</span> <Mono>{formatIsoDateTime(spectrum.createdAt)}</Mono>
            </span>
          </>
        }
        actions={
          mayDelete ? (
            <DeleteRfSpectrumControl benchId={bench.id} id={spectrum.id} name={spectrum.name} onDeleted={() => navigate(paths.benches.rfSpectra.getHref(bench.id), { replace: true })} />
          ) : undefined
        }
      />
      <Section
        id="rf-trace"
        className="mt-10"
        title="Trace and fits"
        lede="The measured power with the three fitted lines; the −20 dB width is marked."
        aside={
          <div className="flex gap-1" role="group" aria-label="Power axis">
            <Button size="sm" variant={scale === 'db' ? 'primary' : 'secondary'} aria-pressed={scale === 'db'} onClick={() => setScale('db')}>
              dB
            </Button>
            <Button size="sm" variant={scale === 'linear' ? 'primary' : 'secondary'} aria-pressed={scale === 'linear'} onClick={() => setScale('linear')}>
              Linear
            </Button>
          </div>
        }
      >
        <RfFitPlot spectrum={spectrum} scale={scale} />
      </Section>
      <Section id="rf-results" className="mt-12" title="Results">
        <RfFitTable spectrum={spectrum} />
      </Section>
    </>
  );
}
