/**
 * The captures of a bench as a ruled table: file, laser, kind, the latest analysis's status (with
 * its progress while it runs) and headline figures, and the date. Filters by laser, kind and tag
 * live in the address (?laser=&kind=&tag=&page=) so a filtered list can be shared and survives
 * going back. While any analysis on the page runs, the list refreshes itself.
 */
import { useEffect, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { CaptureKind, type CaptureSummary } from '../../../../server/contracts/captures';
import type { Laser } from '../../../../server/contracts/lasers';
import { Button, ButtonLink } from '../../../components/ui/button';
import { EmptyNote, ErrorNote, LoadingNote } from '../../../components/ui/notes';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { formatIsoDate, formatIsoDateTime } from '../../../lib/dates';
import { formatSI } from '../../../lib/units';
import { useCaptures } from '../api/list-captures';
import type { CaptureFilters } from '../api/keys';
import { KIND_LABELS, KIND_SHORT, stageLabel } from './capture-labels';

export interface CaptureListProps {
  benchId: string;
  lasers: readonly Laser[];
  /** analysts and owners see the upload action */
  canWrite: boolean;
  pageSize?: number;
}

const selectClasses =
  'h-9 rounded-[3px] border border-rule-strong bg-paper-card px-3 pr-9 text-sm text-ink select-chevron hover:border-ink-faint focus:border-accent';

function StatusCell({ capture }: { capture: CaptureSummary }) {
  const a = capture.latestAnalysis;
  if (!a) return <span className="text-ink-faint">not analysed</span>;
  if (a.status === 'done') return <span className="text-ok">analysed</span>;
  if (a.status === 'failed') return <span className="text-danger">failed</span>;
  const pct = Math.round(a.progress * 100);
  return (
    <span className="flex min-w-[7.5rem] flex-col gap-1">
      <span className="text-xs text-ink-soft">
        {a.status === 'queued' ? 'waiting' : stageLabel(a.stage)} <Mono className="text-ink">{a.status === 'queued' ? '' : `${pct} %`}</Mono>
      </span>
      <span role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} aria-label={`analysis of ${capture.fileName}`} className="block h-[2px] w-full bg-rule">
        <span className="block h-full bg-accent transition-[width]" style={{ width: `${a.status === 'queued' ? 0 : pct}%` }} />
      </span>
    </span>
  );
}

function Figure({ value }: { value: number | null | undefined }) {
  if (value == null || !Number.isFinite(value)) return <span className="text-ink-faint">—</span>;
  return <Quantity q={formatSI(value, 'Hz')} />;
}

export function CaptureList({ benchId, lasers, canWrite, pageSize = 20 }: CaptureListProps) {
  const [params, setParams] = useSearchParams();
  const laserId = params.get('laser') ?? undefined;
  const kindParam = params.get('kind');
  const kind = kindParam && (CaptureKind.options as readonly string[]).includes(kindParam) ? (kindParam as CaptureKind) : undefined;
  const tag = params.get('tag') ?? undefined;
  const page = Math.max(1, Number(params.get('page')) || 1);
  const filters: CaptureFilters = { laserId, kind, tag, page, pageSize };
  const query = useCaptures(benchId, filters);
  const [tagText, setTagText] = useState(tag ?? '');
  useEffect(() => setTagText(tag ?? ''), [tag]);

  const laserName = new Map(lasers.map((l) => [l.id, l.name]));
  const filtered = Boolean(laserId || kind || tag);

  const update = (changes: Record<string, string | undefined>) => {
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        for (const [k, v] of Object.entries(changes)) {
          if (v) next.set(k, v);
          else next.delete(k);
        }
        if (!('page' in changes)) next.delete('page');
        return next;
      },
      { replace: true, preventScrollReset: true },
    );
  };

  const data = query.data;
  const total = data?.total ?? 0;
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);

  return (
    <div data-testid="capture-list">
      <form
        role="search"
        aria-label="Filter captures"
        className="mb-5 flex flex-wrap items-end gap-4"
        onSubmit={(e) => {
          e.preventDefault();
          update({ tag: tagText.trim() || undefined });
        }}
      >
        <label className="flex flex-col gap-1 text-xs text-ink-faint">
          Laser
          <select className={selectClasses} value={laserId ?? ''} onChange={(e) => update({ laser: e.currentTarget.value || undefined })}>
            <option value="">All lasers</option>
            {[...lasers]
              .sort((a, b) => a.name.localeCompare(b.name))
              .map((l) => (
                <option key={l.id} value={l.id}>
                  {l.name}
                </option>
              ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs text-ink-faint">
          Kind
          <select className={selectClasses} value={kind ?? ''} onChange={(e) => update({ kind: e.currentTarget.value || undefined })}>
            <option value="">All kinds</option>
            {CaptureKind.options.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs text-ink-faint">
          Tag
          <input
            className="h-9 w-40 rounded-[3px] border border-rule-strong bg-paper-card px-3 text-sm text-ink hover:border-ink-faint focus:border-accent"
            value={tagText}
            placeholder="any tag"
            onChange={(e) => setTagText(e.currentTarget.value)}
            onBlur={() => {
              if ((tagText.trim() || undefined) !== tag) update({ tag: tagText.trim() || undefined });
            }}
          />
        </label>
        {filtered && (
          <Button variant="quiet" size="sm" onClick={() => update({ laser: undefined, kind: undefined, tag: undefined })}>
            Clear filters
          </Button>
        )}
        {canWrite && (
          <ButtonLink to={paths.benches.upload.getHref(benchId)} variant="primary" size="sm" className="ml-auto">
            Upload a capture
          </ButtonLink>
        )}
      </form>

      {query.isPending ? (
        <LoadingNote>Loading captures…</LoadingNote>
      ) : query.isError ? (
        <ErrorNote
          title="The captures could not be loaded"
          message={isApiError(query.error) ? query.error.message : 'Something went wrong in the page.'}
          onRetry={() => void query.refetch()}
        />
      ) : data && data.captures.length === 0 ? (
        filtered ? (
          <EmptyNote title="No capture matches these filters." action={<Button variant="secondary" size="sm" onClick={() => update({ laser: undefined, kind: undefined, tag: undefined })}>Show all captures</Button>} />
        ) : (
          <EmptyNote
            title="No captures on this bench yet."
            action={canWrite ? <ButtonLink to={paths.benches.upload.getHref(benchId)} variant="secondary" size="sm">Upload the first capture</ButtonLink> : undefined}
          >
            {canWrite
              ? 'Upload a phase, IQ, beat-note or frequency record and its spectrum and linewidths appear here once analysed.'
              : 'An analyst or owner uploads captures; their spectra and linewidths will appear here.'}
          </EmptyNote>
        )
      ) : (
        data && (
          <>
            <table className="w-full border-collapse text-left text-sm" aria-busy={query.isFetching || undefined}>
              <caption className="sr-only">Captures on this bench, newest first</caption>
              <thead>
                <tr className="border-b border-rule-strong text-xs tracking-[0.06em] text-ink-faint uppercase">
                  <th scope="col" className="py-2 pr-4 font-medium">Capture</th>
                  <th scope="col" className="py-2 pr-4 font-medium">Laser</th>
                  <th scope="col" className="py-2 pr-4 font-medium">Kind</th>
                  <th scope="col" className="py-2 pr-4 font-medium">Status</th>
                  <th scope="col" className="py-2 pr-4 text-right font-medium" title="π × the white floor of S_ν">Intrinsic</th>
                  <th scope="col" className="py-2 pr-4 text-right font-medium" title="β-separation-line integrated linewidth">
                    {/* a lower-case β: upper-casing would turn it into a Greek capital that reads as B */}
                    <span className="normal-case">β</span>-line
                  </th>
                  <th scope="col" className="py-2 text-right font-medium">Date</th>
                </tr>
              </thead>
              <tbody>
                {data.captures.map((c) => {
                  const a = c.latestAnalysis;
                  const href = a ? paths.benches.spectrum.getHref(benchId, a.id) : null;
                  return (
                    <tr key={c.id} className="border-b border-rule align-top hover:bg-paper-card/70" data-testid="capture-row">
                      <td className="max-w-[16rem] py-2.5 pr-4">
                        {href ? (
                          <Link to={href} className="block truncate font-medium text-ink underline-offset-4 hover:text-accent hover:underline" title={c.fileName}>
                            {c.fileName}
                          </Link>
                        ) : (
                          <span className="block truncate font-medium text-ink" title={c.fileName}>
                            {c.fileName}
                          </span>
                        )}
                        {c.tags.length > 0 && (
                          <span className="mt-0.5 flex flex-wrap gap-1">
                            {c.tags.map((t) => (
                              <button
                                type="button"
                                key={t}
                                onClick={() => update({ tag: t })}
                                className="rounded-full border border-rule px-1.5 text-[0.6875rem] leading-4 text-ink-soft hover:border-ink-faint hover:text-ink"
                                title={`Show only captures tagged ${t}`}
                              >
                                {t}
                              </button>
                            ))}
                          </span>
                        )}
                      </td>
                      <td className="py-2.5 pr-4 text-ink-soft">
                        {c.laserId ? (
                          <Link to={paths.benches.laser.getHref(benchId, c.laserId)} className="underline-offset-4 hover:text-accent hover:underline">
                            {laserName.get(c.laserId) ?? 'laser'}
                          </Link>
                        ) : (
                          <span className="text-ink-faint">—</span>
                        )}
                      </td>
                      <td className="py-2.5 pr-4 text-ink-soft">{KIND_SHORT[c.kind]}</td>
                      <td className="py-2.5 pr-4" title={a?.status === 'failed' ? 'Open it to see why' : undefined}>
                        <StatusCell capture={c} />
                      </td>
                      <td className="py-2.5 pr-4 text-right">
                        <Figure value={a?.intrinsicLinewidthHz} />
                      </td>
                      <td className="py-2.5 pr-4 text-right">
                        <Figure value={a?.betaLinewidthHz} />
                      </td>
                      <td className="py-2.5 text-right">
                        <Mono className="text-ink-soft" title={formatIsoDateTime(c.createdAt)}>
                          {formatIsoDate(c.createdAt)}
                        </Mono>
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            <nav aria-label="Pages of captures" className="mt-4 flex items-center justify-between text-sm text-ink-soft">
              <span>
                <Mono>
                  {first}–{last}
                </Mono>{' '}
                of <Mono>{total}</Mono>
              </span>
              <span className="flex gap-2">
                <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => update({ page: String(page - 1) })}>
                  Newer
                </Button>
                <Button variant="secondary" size="sm" disabled={last >= total} onClick={() => update({ page: String(page + 1) })}>
                  Older
                </Button>
              </span>
            </nav>
          </>
        )
      )}
    </div>
  );
}
