/**
 * /benches/:benchId/simulations — the rate-equation simulator: a form (owners and analysts) whose runs go
 * to a worker and come back as synthetic IQ captures on the bench (tagged "synthetic", analysed like any
 * upload), and the runs with their progress.
 */
import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import { simulationsQueryOptions, useSimulations } from '../../features/simulations/api/list-simulations';
import { SimulationForm } from '../../features/simulations/components/simulation-form';
import { SimulationList } from '../../features/simulations/components/simulation-list';

export const simulationsLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(lasersQueryOptions(benchId)),
      queryClient.ensureQueryData(simulationsQueryOptions(benchId)),
    ]);
    return null;
  };

export function SimulationsRoute() {
  const benchId = useParams().benchId ?? '';
  const bench = useBench(benchId);
  const lasers = useLasers(benchId);
  const simulations = useSimulations(benchId);
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';
  return (
    <>
      <title>{`Simulator · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'Simulator' },
        ]}
        title="Rate-equation simulator"
        lede="A single-mode semiconductor laser with Langevin noise on carriers, photons and phase, integrated in a worker; each run becomes a synthetic IQ capture on this bench, analysed like an upload — for demos, training and checking the analysis."
      />
      <div className={canWrite ? 'mt-10 grid grid-cols-1 gap-10 lg:grid-cols-[minmax(0,34rem)_minmax(0,1fr)]' : 'mt-10'}>
        {canWrite && (
          <Panel id="new-simulation" title="New simulation">
            <SimulationForm benchId={bench.id} lasers={lasers} />
          </Panel>
        )}
        {/* beside the form, so a run's progress shows where it was started */}
        <Section id="runs" className="self-start lg:sticky lg:top-6" title="Runs" lede="Newest first; progress while a run integrates, then its synthetic capture.">
          <SimulationList benchId={bench.id} simulations={simulations} />
        </Section>
      </div>
    </>
  );
}
