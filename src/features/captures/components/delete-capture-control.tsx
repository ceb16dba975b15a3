/** Deleting a capture (the analyst who uploaded it, or an owner): its file, its analyses and their series go together. */
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { isApiError } from '../../../lib/api-client';
import { useDeleteCapture } from '../api/delete-capture';

export function DeleteCaptureControl({ captureId, fileName, onDeleted }: { captureId: string; fileName: string; onDeleted: () => void }) {
  const [open, setOpen] = useState(false);
  const remove = useDeleteCapture({ onDeleted });
  return (
    <>
      <Button variant="danger" size="sm" onClick={() => setOpen(true)}>
        Delete capture
      </Button>
      <ConfirmDialog
        open={open}
        title="Delete this capture?"
        confirmLabel="Delete capture and its spectra"
        busy={remove.isPending}
        error={remove.isError ? (isApiError(remove.error) ? remove.error.message : 'It could not be deleted.') : null}
        onConfirm={() => remove.mutate(captureId, { onSuccess: () => setOpen(false) })}
        onClose={() => setOpen(false)}
      >
        <p>
          <span className="font-medium">{fileName}</span>, every analysis of it and their series are removed for everyone on the bench. This cannot be
          undone.
        </p>
      </ConfirmDialog>
    </>
  );
}
