/** /benches — the benches I belong to, and a form to start one. */
import type { QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { WorkArea } from '../../components/layout/work-area';
import { EmptyNote } from '../../components/ui/notes';
import { Mono } from '../../components/ui/quantity';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { benchesQueryOptions, useBenches } from '../../features/benches/api/get-benches';
import { BenchList } from '../../features/benches/components/bench-list';
import { CreateBenchForm } from '../../features/benches/components/create-bench-form';

export const benchesLoader = (queryClient: QueryClient) => async () => {
  await queryClient.ensureQueryData(benchesQueryOptions());
  return null;
};

export function BenchesRoute() {
  const benches = useBenches();
  const navigate = useNavigate();
  return (
    <>
      <title>Benches · Phaseloom</title>
      <PageHeader
        title="Benches"
        lede="A bench keeps one team's lasers, captures and spectra together. Everyone on it has a role: owners manage members, analysts change things, viewers read."
      />
      <WorkArea
        className="mt-10"
        main={
          <Section
            id="bench-list"
            title="Your benches"
            aside={
              <span className="text-sm text-ink-faint">
                <Mono>{benches.length}</Mono> {benches.length === 1 ? 'bench' : 'benches'}
              </span>
            }
          >
            {benches.length === 0 ? (
              <EmptyNote title="You are not on any bench yet.">
                Start one with the form beside this list, or ask a bench owner to add you with the e-mail you signed up
                with.
              </EmptyNote>
            ) : (
              <BenchList benches={benches} hrefFor={paths.benches.home.getHref} />
            )}
          </Section>
        }
        side={
          <Panel id="start-bench" title="Start a bench">
            <CreateBenchForm onCreated={(bench) => navigate(paths.benches.home.getHref(bench.id))} />
          </Panel>
        }
      />
    </>
  );
}
