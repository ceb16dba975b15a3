/**
 * /benches/:benchId/overlays — the bench's saved overlays, and a form to make one from its finished
 * spectra. `?add=<analysisId>` (from a spectrum's "Add to overlay") ticks that spectrum in the form
 * and offers the existing overlays to add it to. Owners and analysts also see every share link of the
 * bench here (to spectra and overlays) and can revoke them.
 */
import type { QueryClient } from '@tanstack/react-query';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { EmptyNote } from '../../components/ui/notes';
import { Mono } from '../../components/ui/quantity';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { formatIsoDateTime } from '../../lib/dates';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { capturesQueryOptions } from '../../features/captures/api/list-captures';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import { overlaysQueryOptions, useOverlays } from '../../features/overlays/api/get-overlays';
import { AddToOverlay } from '../../features/overlays/components/add-to-overlay';
import { NewOverlayForm, type SpectrumChoice } from '../../features/overlays/components/new-overlay-form';
import { ShareLinkList } from '../../features/share-links/components/share-link-list';

const ALL_CAPTURES = { page: 1, pageSize: 100 };

export const overlaysLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(overlaysQueryOptions(benchId)),
      queryClient.ensureQueryData(lasersQueryOptions(benchId)),
      queryClient.ensureQueryData(capturesQueryOptions(benchId, ALL_CAPTURES)),
    ]);
    return null;
  };

export function OverlaysRoute() {
  const { benchId = '' } = useParams();
  const [params] = useSearchParams();
  const add = params.get('add');
  const navigate = useNavigate();
  const bench = useBench(benchId);
  const overlays = useOverlays(benchId);
  const lasers = useLasers(benchId);
  const captures = useSuspenseQuery(capturesQueryOptions(benchId, ALL_CAPTURES)).data.captures;
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';
  const laserName = (id: string | null) => (id ? (lasers.find((l) => l.id === id)?.name ?? null) : null);
  const choices: SpectrumChoice[] = captures.flatMap((c) =>
    c.latestAnalysis && c.latestAnalysis.status === 'done'
      ? [{ analysisId: c.latestAnalysis.id, fileName: c.fileName, laserName: laserName(c.laserId), intrinsicLinewidthHz: c.latestAnalysis.intrinsicLinewidthHz }]
      : [],
  );
  const open = (overlayId: string) => navigate(paths.benches.overlay.getHref(benchId, overlayId));

  return (
    <>
      <title>{`Overlays · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'Overlays' },
        ]}
        title="Overlays"
        lede="Several spectra on one plot, with their figures side by side."
      />
      <div className="mt-10 grid gap-10 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
        <Section id="overlay-list" title="Saved overlays" aside={<Mono className="text-sm text-ink-faint">{overlays.length}</Mono>}>
          {overlays.length === 0 ? (
            <EmptyNote title="No overlays yet">{canWrite ? 'Make one with the form beside this list.' : 'Owners and analysts of the bench make them.'}</EmptyNote>
          ) : (
            <ul className="divide-y divide-rule/60">
              {overlays.map((o) => (
                <li key={o.id} className="py-2.5">
                  <Link to={paths.benches.overlay.getHref(benchId, o.id)} className="font-medium text-accent underline-offset-4 hover:underline">
                    {o.name}
                  </Link>
                  <span className="block text-xs text-ink-faint">
                    {o.traceCount} spectra · changed <Mono>{formatIsoDateTime(new Date(o.updatedAt))}</Mono>
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Section>
        {canWrite && (
          <div className="space-y-8">
            {add && overlays.length > 0 && (
              <Panel id="add-to-overlay" title="Add the spectrum to an overlay">
                <AddToOverlay benchId={benchId} analysisId={add} overlays={overlays} onAdded={open} />
              </Panel>
            )}
            <Panel id="new-overlay" title="New overlay">
              <NewOverlayForm benchId={benchId} choices={choices} initial={add ? [add] : []} onCreated={open} />
            </Panel>
          </div>
        )}
      </div>
      {canWrite && (
        <Section id="bench-share-links" className="mt-12" title="Share links on this bench" lede="Read-only links to spectra and overlays; revoke one and it stops working at once.">
          <ShareLinkList benchId={benchId} />
        </Section>
      )}
    </>
  );
}
