/** /benches/:benchId/lasers/:laserId — a laser: what it is, and its spectra over time with the linewidth trend. */
import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { ButtonLink } from '../../components/ui/button';
import { Quantity } from '../../components/ui/quantity';
import { Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { formatFrequencyThz, formatWavelengthNm } from '../../lib/units';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { LASER_TYPE_LABELS } from '../../features/lasers/components/laser-type-labels';
import { laserSpectraQueryOptions, useLaserSpectra } from '../../features/spectra/api/get-laser-spectra';
import { LaserSpectra } from '../../features/spectra/components/laser-spectra';

export const laserLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    const laserId = params.laserId ?? '';
    await Promise.all([queryClient.ensureQueryData(benchQueryOptions(benchId)), queryClient.ensureQueryData(laserSpectraQueryOptions(benchId, laserId))]);
    return null;
  };

export function LaserRoute() {
  const { benchId = '', laserId = '' } = useParams();
  const bench = useBench(benchId);
  const { laser } = useLaserSpectra(benchId, laserId);
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';

  return (
    <>
      <title>{`${laser.name} · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: laser.name },
        ]}
        title={laser.name}
        lede={laser.notes ?? undefined}
        meta={
          <>
            <span>
              <span className="text-ink-faint">type</span> {LASER_TYPE_LABELS[laser.type]}
            </span>
            <span>
              <span className="text-ink-faint">wavelength</span> <Quantity q={formatWavelengthNm(laser.wavelengthNm)} />
            </span>
            <span>
              <span className="text-ink-faint">frequency</span> <Quantity q={formatFrequencyThz(laser.frequencyThz)} />
            </span>
          </>
        }
        actions={
          <div className="flex items-center gap-3">
            <ButtonLink to={paths.benches.sweep.getHref(bench.id, laser.id)} data-testid="laser-sweep">
              Linewidth sweep
            </ButtonLink>
            <ButtonLink to={paths.benches.laserModel.getHref(bench.id, laser.id)}>Laser model</ButtonLink>
            {canWrite && (
              <ButtonLink to={paths.benches.upload.getHref(bench.id, laser.id)} variant="primary">
                Upload a capture
              </ButtonLink>
            )}
          </div>
        }
      />
      <Section id="laser-spectra" className="mt-10" title="Spectra over time" lede="Intrinsic and β-line linewidths of this laser's analysed captures, by date.">
        <LaserSpectra benchId={bench.id} laserId={laser.id} canWrite={canWrite} />
      </Section>
    </>
  );
}
