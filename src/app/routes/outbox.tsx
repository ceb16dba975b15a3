/**
 * /outbox — e-mail caught by the local mail catcher, for development and tests (the server answers
 * 404 in production). Needs no sign-in: it is where an invitation or reset link is picked up.
 */
import { Wordmark } from '../../components/layout/wordmark';
import { ErrorNote, LoadingNote } from '../../components/ui/notes';
import { useOutbox } from '../../features/outbox/api/get-outbox';
import { OutboxList } from '../../features/outbox/components/outbox-list';
import { isApiError } from '../../lib/api-client';

export function OutboxRoute() {
  const outbox = useOutbox();
  return (
    <main id="main" className="mx-auto max-w-[52rem] px-10 pt-12 pb-16">
      <title>Outbox · Phaseloom</title>
      <Wordmark />
      <h1 className="mt-8 text-2xl font-semibold tracking-tight">Outbox</h1>
      <p className="mt-1.5 mb-8 max-w-prose text-sm text-ink-soft">
        E-mail this server sent, as the local mail catcher received it. Nothing here left the machine. Refreshes every few seconds.
      </p>
      {outbox.isPending ? (
        <LoadingNote>Reading the outbox…</LoadingNote>
      ) : outbox.isError ? (
        <ErrorNote
          title={isApiError(outbox.error) && outbox.error.status === 404 ? 'There is no outbox on this server' : 'The outbox could not be read'}
          message={
            isApiError(outbox.error) && outbox.error.status === 404
              ? 'In production e-mail goes to the configured mail server and is not kept here.'
              : outbox.error.message
          }
          onRetry={() => void outbox.refetch()}
        />
      ) : (
        <OutboxList messages={outbox.data.messages} />
      )}
    </main>
  );
}
