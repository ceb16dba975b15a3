/**
 * The list of marks beside the spectrum plot, numbered as the plot labels them: kind (its colour),
 * place, text, author. Analysts and owners add marks; a mark's author or an owner edits or deletes it.
 * Marks belong to the capture, so every analysis of it shows the same list.
 */
import { useState } from 'react';
import type { Mark } from '../../../../server/contracts/marks';
import { Button } from '../../../components/ui/button';
import { Mono } from '../../../components/ui/quantity';
import { isApiError } from '../../../lib/api-client';
import { formatIsoDate } from '../../../lib/dates';
import { useCreateMark } from '../api/create-mark';
import { useDeleteMark } from '../api/delete-mark';
import { useMarks } from '../api/list-marks';
import { useUpdateMark } from '../api/update-mark';
import { MarkForm } from './mark-form';
import { MARK_COLORS, markKindLabel, markPlaceText } from './mark-style';

export interface MarksPanelProps {
  captureId: string;
  /** analysts and owners add marks */
  canWrite: boolean;
}

export function MarksPanel({ captureId, canWrite }: MarksPanelProps) {
  const { marks, bandHz } = useMarks(captureId);
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<string | null>(null);
  const create = useCreateMark(captureId, { onCreated: () => setAdding(false) });

  return (
    <section aria-labelledby="marks-heading" className="min-w-0" data-testid="marks-panel">
      <div className="mb-3 flex items-baseline justify-between gap-3 border-b border-rule pb-2.5">
        <h2 id="marks-heading" className="text-lg font-semibold tracking-tight text-ink">
          Marks
        </h2>
        <span className="text-xs text-ink-faint">
          <Mono>{marks.length}</Mono> on this capture
        </span>
      </div>
      {marks.length === 0 && !adding && (
        <p className="text-sm leading-relaxed text-ink-faint">
          No marks yet. {canWrite ? 'Pin a note to a frequency or a band — a mains line, a servo bump — and everyone on the bench sees it on every analysis of this capture.' : 'Analysts and owners pin notes to frequencies here.'}
        </p>
      )}
      <ol className="flex flex-col divide-y divide-rule" data-testid="marks-list">
        {marks.map((mark, i) =>
          editing === mark.id ? (
            <li key={mark.id} className="py-3">
              <EditMark captureId={captureId} mark={mark} bandHz={bandHz} onDone={() => setEditing(null)} />
            </li>
          ) : (
            <MarkItem key={mark.id} n={i + 1} mark={mark} captureId={captureId} onEdit={() => setEditing(mark.id)} />
          ),
        )}
      </ol>
      {canWrite &&
        (adding ? (
          <div className="mt-3 rounded-[4px] border border-rule bg-paper-card px-4 py-4">
            <MarkForm
              bandHz={bandHz}
              submitLabel="Add mark"
              busy={create.isPending}
              failure={create.error}
              onSubmit={(body) => create.mutate(body)}
              onCancel={() => {
                create.reset();
                setAdding(false);
              }}
            />
          </div>
        ) : (
          <Button variant="secondary" size="sm" className="mt-3" onClick={() => setAdding(true)} disabled={!bandHz}>
            Add a mark
          </Button>
        ))}
    </section>
  );
}

function MarkItem({ n, mark, captureId, onEdit }: { n: number; mark: Mark; captureId: string; onEdit: () => void }) {
  const remove = useDeleteMark(captureId);
  // a second click confirms: marks are shared evidence, one slip should not remove one
  const [confirming, setConfirming] = useState(false);
  const color = MARK_COLORS[mark.kind];
  return (
    <li className="flex gap-3 py-3" data-testid="mark-item">
      <span
        aria-hidden="true"
        className="mt-0.5 flex h-5 w-5 shrink-0 items-center justify-center rounded-full font-mono text-[0.6875rem] font-semibold text-paper-card"
        style={{ backgroundColor: color }}
      >
        {n}
      </span>
      <div className="min-w-0 flex-1">
        <p className="flex flex-wrap items-baseline gap-x-2 text-xs">
          <span className="font-medium" style={{ color }}>
            {markKindLabel(mark.kind)}
          </span>
          <Mono className="text-ink-soft">{markPlaceText(mark)}</Mono>
        </p>
        <p className="mt-0.5 text-sm leading-snug break-words text-ink">{mark.text}</p>
        <p className="mt-0.5 text-xs text-ink-faint">
          {mark.authorName ?? 'a former member'} · <Mono>{formatIsoDate(mark.createdAt)}</Mono>
        </p>
        {mark.canEdit && (
          <div className="mt-1 flex gap-3">
            <Button variant="quiet" size="sm" className="h-6 text-xs" onClick={onEdit}>
              Edit
            </Button>
            {confirming ? (
              <>
                <Button variant="quiet" size="sm" className="h-6 text-xs text-danger" busy={remove.isPending} onClick={() => remove.mutate(mark.id)} aria-label={`Yes, delete mark ${n}`}>
                  Yes, delete it
                </Button>
                <Button variant="quiet" size="sm" className="h-6 text-xs" onClick={() => setConfirming(false)}>
                  Keep
                </Button>
              </>
            ) : (
              <Button variant="quiet" size="sm" className="h-6 text-xs text-danger" onClick={() => setConfirming(true)} aria-label={`Delete mark ${n}`}>
                Delete
              </Button>
            )}
          </div>
        )}
        {remove.isError && (
          <p role="alert" className="mt-1 text-xs text-danger">
            {isApiError(remove.error) ? remove.error.message : 'The mark could not be deleted.'}
          </p>
        )}
      </div>
    </li>
  );
}

function EditMark({ captureId, mark, bandHz, onDone }: { captureId: string; mark: Mark; bandHz: readonly [number, number] | null; onDone: () => void }) {
  const update = useUpdateMark(captureId, { onUpdated: onDone });
  return (
    <MarkForm
      bandHz={bandHz}
      mark={mark}
      submitLabel="Save mark"
      busy={update.isPending}
      failure={update.error}
      onSubmit={(body) => update.mutate({ markId: mark.id, body })}
      onCancel={onDone}
    />
  );
}
