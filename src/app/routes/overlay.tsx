/**
 * /benches/:benchId/overlays/:overlayId — one overlay: its spectra on one plot with a legend, their
 * figures side by side (each removable), rename, share and delete for owners and analysts.
 */
import type { QueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { Button, ButtonLink } from '../../components/ui/button';
import { ConfirmDialog } from '../../components/ui/confirm-dialog';
import { TextField } from '../../components/ui/field';
import { FormAlert } from '../../components/ui/notes';
import { Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { useDeleteOverlay } from '../../features/overlays/api/delete-overlay';
import { overlayQueryOptions, useOverlay } from '../../features/overlays/api/get-overlay';
import { useUpdateOverlay } from '../../features/overlays/api/update-overlay';
import { OverlayFiguresTable } from '../../features/overlays/components/overlay-figures-table';
import { OverlayPlot } from '../../features/overlays/components/overlay-plot';
import { ShareControl } from '../../features/share-links/components/share-control';
import { ShareLinkList } from '../../features/share-links/components/share-link-list';

export const overlayLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(params.benchId ?? '')),
      queryClient.ensureQueryData(overlayQueryOptions(params.overlayId ?? '')),
    ]);
    return null;
  };

export function OverlayRoute() {
  const { benchId = '', overlayId = '' } = useParams();
  const bench = useBench(benchId);
  const overlay = useOverlay(overlayId);
  const navigate = useNavigate();
  const update = useUpdateOverlay(benchId, overlayId);
  const remove = useDeleteOverlay(benchId);
  const [name, setName] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';

  const traces = overlay.traces.map((t) => ({
    key: t.analysisId,
    label: t.laserName ? `${t.fileName} · ${t.laserName}` : t.fileName,
    color: t.color,
    frequencyHz: t.series?.frequencyHz ?? [],
    sNu: t.series?.frequencyNoiseHz2PerHz ?? [],
  }));
  const columns = overlay.traces.map((t) => ({
    key: t.analysisId,
    color: t.color,
    title: t.fileName,
    subtitle: t.laserName,
    figures: t.figures,
    settings: t.settings,
    operatingPoint: t.operatingPoint,
  }));

  const rename = (e: FormEvent) => {
    e.preventDefault();
    if (name === null) return;
    update.mutate({ name }, { onSuccess: () => setName(null) });
  };

  return (
    <>
      <title>{`${overlay.name} · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'Overlays', to: paths.benches.overlays.getHref(bench.id) },
          { label: overlay.name },
        ]}
        title={overlay.name}
        lede={`${overlay.traces.length} spectra on one plot; colours follow each spectrum's place in the overlay.`}
        actions={
          <div className="flex flex-wrap items-start gap-2">
            <ButtonLink to={paths.benches.overlayReport.getHref(bench.id, overlay.id)}>Print report</ButtonLink>
            {canWrite ? (
              <>
                <ShareControl benchId={bench.id} target={{ kind: 'overlay', id: overlay.id }} />
                <Button type="button" variant="danger" onClick={() => setConfirming(true)}>
                  Delete
                </Button>
              </>
            ) : null}
          </div>
        }
      />
      <div className="mt-8">
        <OverlayPlot traces={traces} label={`Frequency-noise spectra of the overlay ${overlay.name}`} />
      </div>
      <Section id="overlay-figures" className="mt-10" title="Figures side by side">
        <OverlayFiguresTable
          columns={columns}
          removing={update.isPending}
          onRemove={canWrite ? (key) => update.mutate({ analysisIds: overlay.traces.map((t) => t.analysisId).filter((id) => id !== key) }) : undefined}
        />
        <FormAlert message={update.error?.message} />
      </Section>
      {canWrite && (
        <div className="mt-10 grid gap-10 lg:grid-cols-2">
          <Section id="overlay-rename" title="Name">
            <form onSubmit={rename} className="flex items-end gap-3">
              <TextField label="Overlay name" value={name ?? overlay.name} onChange={(e) => setName(e.target.value)} maxLength={120} fieldClassName="flex-1" />
              <Button type="submit" variant="secondary" disabled={name === null || name.trim() === ''} busy={update.isPending && name !== null}>
                Rename
              </Button>
            </form>
          </Section>
          <Section id="overlay-share-links" title="Share links">
            <ShareLinkList benchId={bench.id} targetId={overlay.id} />
          </Section>
        </div>
      )}
      <ConfirmDialog
        open={confirming}
        title="Delete this overlay?"
        confirmLabel="Delete overlay"
        busy={remove.isPending}
        error={remove.error?.message ?? null}
        onClose={() => setConfirming(false)}
        onConfirm={() => remove.mutate(overlay.id, { onSuccess: () => navigate(paths.benches.overlays.getHref(bench.id), { replace: true }) })}
      >
        The spectra stay on the bench; only this comparison and its share links go.
      </ConfirmDialog>
    </>
  );
}
