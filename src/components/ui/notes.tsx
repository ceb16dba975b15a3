/**
 * The three states every page shows: loading, empty, and failed (with what to do, and a retry).
 */
import type { ReactNode } from 'react';
import { Button } from './button';
import { cn } from './cn';

export function LoadingNote({ children = 'Loading…', className }: { children?: ReactNode; className?: string }) {
  return (
    <p role="status" aria-live="polite" className={cn('flex items-center gap-3 py-6 text-sm text-ink-faint', className)}>
      <span aria-hidden="true" className="loading-rule" />
      {children}
    </p>
  );
}

export interface EmptyNoteProps {
  title: ReactNode;
  children?: ReactNode;
  action?: ReactNode;
  className?: string;
}

/** An empty list, said plainly with the next step. */
export function EmptyNote({ title, children, action, className }: EmptyNoteProps) {
  return (
    <div className={cn('rounded-[4px] border border-dashed border-rule-strong px-6 py-7', className)}>
      <p className="font-medium text-ink">{title}</p>
      {children && <div className="mt-1.5 max-w-prose text-sm leading-relaxed text-ink-soft">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}

export interface ErrorNoteProps {
  title?: ReactNode;
  message: ReactNode;
  onRetry?: () => void;
  retryLabel?: string;
  children?: ReactNode;
  className?: string;
}

export function ErrorNote({ title = 'This could not be loaded', message, onRetry, retryLabel = 'Try again', children, className }: ErrorNoteProps) {
  return (
    <div role="alert" className={cn('border-l-2 border-danger bg-danger-soft/50 py-4 pr-4 pl-5', className)}>
      <p className="font-medium text-danger">{title}</p>
      <p className="mt-1 max-w-prose text-sm leading-relaxed text-ink-soft">{message}</p>
      {(onRetry || children) && (
        <div className="mt-3 flex flex-wrap items-center gap-4">
          {onRetry && (
            <Button variant="secondary" size="sm" onClick={onRetry}>
              {retryLabel}
            </Button>
          )}
          {children}
        </div>
      )}
    </div>
  );
}

/** A message for a whole form (beside the submit button), announced when it appears. */
export function FormAlert({ message, className }: { message: string | null | undefined; className?: string }) {
  if (!message) return null;
  return (
    <p role="alert" className={cn('border-l-2 border-danger bg-danger-soft/50 py-2 pr-3 pl-3 text-sm leading-relaxed text-danger', className)}>
      {message}
    </p>
  );
}

/** A short confirmation after a change ("Role changed"), announced politely. */
export function DoneNote({ message, className }: { message: string | null | undefined; className?: string }) {
  return (
    <p role="status" aria-live="polite" className={cn('text-sm text-ok', !message && 'sr-only', className)}>
      {message ?? ''}
    </p>
  );
}
