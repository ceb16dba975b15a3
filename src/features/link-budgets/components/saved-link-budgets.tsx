/** The bench's saved link budgets: what each checked and its verdict; open one into the form, delete one. */
import type { SavedLinkBudget } from '../../../../server/contracts/link-budgets';
import { Button } from '../../../components/ui/button';
import { EmptyNote, FormAlert } from '../../../components/ui/notes';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { formatIsoDate } from '../../../lib/dates';
import { formatFixed, formatSI } from '../../../lib/units';
import { useDeleteLinkBudget } from '../api/delete-link-budget';

export interface SavedLinkBudgetsProps {
  benchId: string;
  budgets: readonly SavedLinkBudget[];
  userId: string;
  role: 'owner' | 'analyst' | 'viewer';
  onOpen: (budget: SavedLinkBudget) => void;
}

export function SavedLinkBudgets({ benchId, budgets, userId, role, onOpen }: SavedLinkBudgetsProps) {
  const remove = useDeleteLinkBudget(benchId);
  if (budgets.length === 0) {
    return <EmptyNote title="No budgets saved on this bench yet.">{role === 'viewer' ? 'Analysts and owners save budgets; they will appear here.' : 'Evaluate one, then save it with a name.'}</EmptyNote>;
  }
  return (
    <>
      <FormAlert message={remove.error ? remove.error.message : null} />
      <ul className="divide-y divide-rule border-y border-rule" aria-label="Saved link budgets">
        {budgets.map((b) => {
          const r = b.result;
          const mayDelete = role === 'owner' || (role === 'analyst' && b.createdBy === userId);
          return (
            <li key={b.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
              <div className="min-w-0">
                <p className="font-medium text-ink">{b.name}</p>
                <p className="text-sm text-ink-faint">
                  {r.format} at <Quantity q={formatSI(r.symbolRateBaud, 'Bd')} /> · Δν <Quantity q={formatSI(r.combinedLinewidthHz, 'Hz')} /> ·{' '}
                  {r.pass === null ? 'no verdict' : r.pass ? 'within' : 'exceeds'}
                  {r.marginDb !== null && (
                    <>
                      {' '}
                      (<Quantity q={formatFixed(r.marginDb, 'dB', 1)} />)
                    </>
                  )}{' '}
                  · <Mono>{formatIsoDate(b.createdAt)}</Mono>
                  {b.createdByName ? ` · ${b.createdByName}` : ''}
                </p>
              </div>
              <div className="flex items-center gap-2">
                <Button variant="secondary" size="sm" onClick={() => onOpen(b)}>
                  Open
                </Button>
                {mayDelete && (
                  <Button variant="danger" size="sm" busy={remove.isPending && remove.variables === b.id} onClick={() => remove.mutate(b.id)} aria-label={`Delete ${b.name}`}>
                    Delete
                  </Button>
                )}
              </div>
            </li>
          );
        })}
      </ul>
    </>
  );
}
