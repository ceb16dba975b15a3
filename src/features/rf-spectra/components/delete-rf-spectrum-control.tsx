/** Delete an RF spectrum after a confirmation (an owner, or the analyst who uploaded it). */
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { isApiError } from '../../../lib/api-client';
import { useDeleteRfSpectrum } from '../api/delete-rf-spectrum';

export function DeleteRfSpectrumControl({ benchId, id, name, onDeleted }: { benchId: string; id: string; name: string; onDeleted: () => void }) {
  const [open, setOpen] = useState(false);
  const remove = useDeleteRfSpectrum(benchId);
  return (
    <>
      <Button variant="danger" size="sm" onClick={() => setOpen(true)}>
        Delete spectrum
      </Button>
      <ConfirmDialog
        open={open}
        title="Delete this RF spectrum?"
        confirmLabel="Delete the spectrum and its fits"
        busy={remove.isPending}
        error={remove.isError ? (isApiError(remove.error) ? remove.error.message : 'It could not be deleted.') : null}
        onConfirm={() => remove.mutate(id, { onSuccess: () => { setOpen(false); onDeleted(); } })}
        onClose={() => setOpen(false)}
      >
        <p>
          <span className="font-medium">{name}</span> and its fits are removed for everyone on the bench. This cannot be undone.
        </p>
      </ConfirmDialog>
    </>
  );
}
