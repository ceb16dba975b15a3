/** /benches/:benchId — a bench's home: what it is, its captures, its lasers, and (for owners) its record. */
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { Button, ButtonLink } from '../../components/ui/button';
import { EmptyNote } from '../../components/ui/notes';
import { Mono } from '../../components/ui/quantity';
import { RoleTag } from '../../components/ui/role-tag';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { formatIsoDate } from '../../lib/dates';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { benchKeys } from '../../features/benches/api/keys';
import { BenchRecordForm } from '../../features/benches/components/bench-record-form';
import { DeleteBenchControl } from '../../features/benches/components/delete-bench-control';
import { CaptureList } from '../../features/captures/components/capture-list';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import { LaserForm } from '../../features/lasers/components/laser-form';
import { LaserList } from '../../features/lasers/components/laser-list';
import type { RouteHandle } from './app-layout';

export const benchHomeHandle: RouteHandle = { laserSafety: true };

export const benchHomeLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(lasersQueryOptions(benchId)),
    ]);
    return null;
  };

export function BenchHomeRoute() {
  const benchId = useParams().benchId ?? '';
  const bench = useBench(benchId);
  const lasers = useLasers(benchId);
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';
  const isOwner = bench.role === 'owner';
  // an empty bench opens the form at once; otherwise it waits for "Add a laser"
  const [adding, setAdding] = useState(canWrite && lasers.length === 0);
  // the bench list shows counts of lasers; keep it honest after a change here
  const refreshCounts = () => void queryClient.invalidateQueries({ queryKey: benchKeys.lists() });

  return (
    <>
      <title>{`${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[{ label: 'Benches', to: paths.benches.list.getHref() }, { label: bench.name }]}
        title={bench.name}
        lede={bench.description ?? <span className="text-ink-faint italic">No description yet.</span>}
        meta={
          <>
            <span className="flex items-center gap-2">
              <span className="text-ink-faint">your role</span> <RoleTag role={bench.role} />
            </span>
            <span>
              <span className="text-ink-faint">started</span> <Mono>{formatIsoDate(bench.createdAt)}</Mono>
            </span>
          </>
        }
        actions={
          <>
            <ButtonLink to={paths.benches.overlays.getHref(bench.id)}>Overlays</ButtonLink>
            <ButtonLink to={paths.benches.rfSpectra.getHref(bench.id)}>RF spectra</ButtonLink>
            <ButtonLink to={paths.benches.linkBudgets.getHref(bench.id)}>Link budgets</ButtonLink>
            <ButtonLink to={paths.benches.simulations.getHref(bench.id)}>Simulator</ButtonLink>
            <ButtonLink to={paths.benches.members.getHref(bench.id)}>Members</ButtonLink>
          </>
        }
      />

      <Section
        id="captures"
        className="mt-10"
        title="Captures"
        lede="Uploaded records with their latest analysis: status, intrinsic and β-line linewidths. Open one for its spectrum."
      >
        <CaptureList benchId={bench.id} lasers={lasers} canWrite={canWrite} />
      </Section>

      <Section
        id="lasers"
        className="mt-14"
        title="Lasers"
        lede={
          canWrite
            ? 'Devices under test on this bench, with their nominal wavelength and optical frequency.'
            : 'Devices under test on this bench. As a viewer you read them; analysts and owners add and edit.'
        }
        aside={
          <div className="flex items-center gap-5">
            <span className="text-sm text-ink-faint">
              <Mono>{lasers.length}</Mono> {lasers.length === 1 ? 'laser' : 'lasers'}
            </span>
            {canWrite && !adding && (
              <Button variant="secondary" size="sm" onClick={() => setAdding(true)}>
                Add a laser
              </Button>
            )}
          </div>
        }
      >
        {lasers.length === 0 ? (
          <EmptyNote title="No lasers on this bench yet.">
            {canWrite
              ? 'Add the first device under test below: a name, its type and its nominal wavelength or optical frequency.'
              : 'An analyst or owner adds lasers; they will appear here.'}
          </EmptyNote>
        ) : (
          <LaserList benchId={bench.id} lasers={lasers} canWrite={canWrite} onChanged={refreshCounts} />
        )}
        {canWrite && adding && (
          <Panel id="add-laser" title="Add a laser" className="mt-8">
            <LaserForm
              benchId={bench.id}
              onChanged={refreshCounts}
              onCancel={lasers.length > 0 ? () => setAdding(false) : undefined}
            />
          </Panel>
        )}
      </Section>

      {isOwner && (
        <div className="mt-16 grid grid-cols-[minmax(0,1fr)_20rem] gap-14">
          <Section id="bench-record" title="Bench record" lede="Only owners see this part.">
            <div className="max-w-[34rem]">
              <BenchRecordForm bench={bench} onSaved={refreshCounts} />
            </div>
          </Section>
          <Section id="delete-bench" title="Delete" lede="For good, for everyone.">
            <DeleteBenchControl bench={bench} onDeleted={() => navigate(paths.benches.list.getHref(), { replace: true })} />
          </Section>
        </div>
      )}
    </>
  );
}
