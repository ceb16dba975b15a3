/**
 * /shared/:token — what a share link opens, without signing in: the plot, the figures side by side,
 * the marks and where each spectrum came from; nothing else of the bench. A revoked or expired link
 * (410) and an unknown one (404) get a plain page saying so.
 */
import type { QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { useParams, useRouteError, type LoaderFunctionArgs } from 'react-router';
import { Wordmark } from '../../components/layout/wordmark';
import { Section } from '../../components/ui/section';
import { Mono } from '../../components/ui/quantity';
import { isApiError } from '../../lib/api-client';
import { formatIsoDateTime } from '../../lib/dates';
import { OverlayFiguresTable } from '../../features/overlays/components/overlay-figures-table';
import { OverlayPlot } from '../../features/overlays/components/overlay-plot';
import { sharedQueryOptions, useShared } from '../../features/share-links/api/get-shared';
import { SharedProvenance } from '../../features/share-links/components/shared-provenance';

export const sharedLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(sharedQueryOptions(params.token ?? ''));
    return null;
  };

function SharedFrame({ children }: { children: ReactNode }) {
  return (
    <main id="main" className="mx-auto max-w-page px-6 pt-6 pb-16 md:px-10">
      <Wordmark />
      <div className="mt-8">{children}</div>
    </main>
  );
}

export function SharedRoute() {
  const { token = '' } = useParams();
  const shared = useShared(token);
  const traces = shared.traces.map((t, i) => ({
    key: String(i),
    label: t.label,
    color: t.color,
    frequencyHz: t.series?.frequencyHz ?? [],
    sNu: t.series?.frequencyNoiseHz2PerHz ?? [],
  }));
  const marks = shared.traces.flatMap((t, i) =>
    t.marks.map((m, j) => ({ key: `${i}-${j}`, loHz: m.bandHz ? m.bandHz[0] : (m.frequencyHz ?? 0), hiHz: m.bandHz ? m.bandHz[1] : null, label: m.text })),
  );
  const columns = shared.traces.map((t, i) => ({
    key: String(i),
    color: t.color,
    title: t.provenance.fileName,
    subtitle: t.provenance.laserName,
    figures: t.figures,
    settings: t.settings,
    operatingPoint: t.provenance.operatingPoint,
  }));

  return (
    <SharedFrame>
      <title>{`${shared.title} · shared · Phaseloom`}</title>
      <header className="border-b border-rule pb-6">
        <p className="text-xs font-medium tracking-[0.08em] text-ink-faint uppercase">{shared.kind === 'overlay' ? 'Shared overlay' : 'Shared spectrum'} · read-only</p>
        <h1 className="mt-2 text-2xl font-semibold tracking-tight break-all text-ink">{shared.title}</h1>
        <p className="mt-1 text-sm text-ink-soft">
          {shared.expiresAt ? (
            <>
              This link works until <Mono>{formatIsoDateTime(new Date(shared.expiresAt))}</Mono>.
            </>
          ) : (
            'This link works until the bench that made it revokes it.'
          )}
        </p>
      </header>
      <div className="mt-8">
        <OverlayPlot traces={traces} marks={marks} label={`Frequency-noise spectrum: ${shared.title}`} />
      </div>
      <Section id="shared-figures" className="mt-10" title="Figures">
        <OverlayFiguresTable columns={columns} />
      </Section>
      <Section id="shared-provenance" className="mt-10" title="Where the data came from">
        <SharedProvenance traces={shared.traces} />
      </Section>
    </SharedFrame>
  );
}

/** 410: revoked or expired; 404: no such link; anything else: try again later. */
export function SharedError() {
  const error = useRouteError();
  const status = isApiError(error) ? error.status : 0;
  const title =
    status === 410 ? 'This shared link no longer works' : status === 404 ? 'No such shared link' : status === 429 ? 'Too many requests' : 'The shared page could not be loaded';
  const message =
    status === 410 || status === 404 || status === 429
      ? (error as Error).message
      : 'Try again in a moment; if it keeps happening, ask whoever sent you the link.';
  return (
    <SharedFrame>
      <title>{`${title} · Phaseloom`}</title>
      <div className="max-w-[40rem]" data-testid="shared-error" data-status={status}>
        <h1 className="text-2xl font-semibold tracking-tight text-ink">{title}</h1>
        <p className="mt-2 text-ink-soft">{message.charAt(0).toUpperCase() + message.slice(1)}.</p>
        {status === 410 && <p className="mt-4 text-sm text-ink-faint">The people who shared it can make a new link from their bench.</p>}
        <p className="mt-6 font-mono text-sm text-ink-faint">({status || 'error'})</p>
      </div>
    </SharedFrame>
  );
}
