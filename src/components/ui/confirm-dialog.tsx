/**
 * A confirmation in the browser's own modal <dialog> (it traps focus and closes on Escape).
 * The confirming action is explicit ("Remove laser"), never just "OK".
 */
import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button';
import { FormAlert } from './notes';

export interface ConfirmDialogProps {
  open: boolean;
  title: ReactNode;
  children: ReactNode;
  confirmLabel: string;
  busy?: boolean;
  error?: string | null;
  onConfirm: () => void;
  onClose: () => void;
}

export function ConfirmDialog({ open, title, children, confirmLabel, busy, error, onConfirm, onClose }: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      onCancel={(e) => {
        if (busy) e.preventDefault();
      }}
      className="paper-dialog m-auto w-[min(30rem,calc(100vw-2rem))] rounded-[4px] border border-rule-strong bg-paper-card p-0 text-ink"
    >
      <div className="px-7 pt-6 pb-6">
        <h2 id={titleId} className="text-lg font-semibold tracking-tight">
          {title}
        </h2>
        <div className="mt-2 text-sm leading-relaxed text-ink-soft">{children}</div>
        <FormAlert message={error} className="mt-4" />
        <div className="mt-6 flex justify-end gap-3">
          <Button variant="secondary" onClick={onClose} disabled={busy} autoFocus>
            Keep it
          </Button>
          <Button variant="danger" onClick={onConfirm} busy={busy} busyLabel="Working…">
            {confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}
