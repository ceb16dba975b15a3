import { Fragment, type ReactNode } from 'react';
import type { OutboxMessage } from '../../../../server/contracts/outbox';
import { EmptyNote } from '../../../components/ui/notes';
import { formatIsoDateTime } from '../../../lib/dates';

/** Plain text with its http(s) addresses as links. */
function withLinks(text: string): ReactNode[] {
  return text.split(/(https?:\/\/[^\s<>"]+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="break-all text-accent underline underline-offset-2">
        {part}
      </a>
    ) : (
      <Fragment key={i}>{part}</Fragment>
    ),
  );
}

/** The caught messages, newest first, each with its full text. */
export function OutboxList({ messages }: { messages: OutboxMessage[] }) {
  if (messages.length === 0) {
    return (
      <EmptyNote title="No e-mail caught yet">
        Invitations, password-reset links and analysis notices sent by this server appear here.
      </EmptyNote>
    );
  }
  return (
    <ol className="flex flex-col gap-5" aria-label="Caught e-mail">
      {messages.map((m) => (
        <li key={m.id}>
          <article aria-label={m.subject} className="rounded-[4px] border border-rule bg-paper-card px-6 py-5">
            <header className="flex flex-wrap items-baseline justify-between gap-x-6 gap-y-1">
              <h2 className="font-medium text-ink">{m.subject || '(no subject)'}</h2>
              <time dateTime={m.receivedAt} className="text-xs text-ink-faint tabular-nums">
                {formatIsoDateTime(m.receivedAt)}
              </time>
            </header>
            <p className="mt-1 text-sm text-ink-soft">
              To <span className="text-ink">{m.recipients.join(', ') || m.to}</span> · from {m.from}
            </p>
            <pre className="mt-4 font-sans text-sm leading-relaxed whitespace-pre-wrap text-ink">{withLinks(m.text)}</pre>
          </article>
        </li>
      ))}
    </ol>
  );
}
