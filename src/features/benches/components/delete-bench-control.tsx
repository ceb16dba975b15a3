import { useState } from 'react';
import type { Bench } from '../../../../server/contracts/benches';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { useDeleteBench } from '../api/delete-bench';

/** The owner's way to delete a bench, behind a confirmation that says what goes with it. */
export function DeleteBenchControl({ bench, onDeleted }: { bench: Bench; onDeleted: () => unknown }) {
  const [open, setOpen] = useState(false);
  const deleteBench = useDeleteBench(bench.id, { onDeleted });
  return (
    <div className="flex flex-col items-start gap-3">
      <p className="max-w-prose text-sm leading-relaxed text-ink-soft">
        Deleting the bench removes its lasers and its member list for everyone. It cannot be undone.
      </p>
      <Button variant="danger" onClick={() => setOpen(true)}>
        Delete bench…
      </Button>
      <ConfirmDialog
        open={open}
        title={`Delete “${bench.name}”?`}
        confirmLabel="Delete bench"
        busy={deleteBench.isPending}
        error={deleteBench.error?.message}
        onConfirm={() => deleteBench.mutate()}
        onClose={() => {
          setOpen(false);
          deleteBench.reset();
        }}
      >
        Its lasers and member list go with it, for every member. This cannot be undone.
      </ConfirmDialog>
    </div>
  );
}
