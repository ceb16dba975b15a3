/**
 * The comment thread of a capture's spectrum (one thread per capture, shown on every analysis of
 * it): oldest first, with the author and the date; analysts and owners write; the author or an owner
 * deletes.
 */
import { useRef, type FormEvent } from 'react';
import { COMMENT_TEXT_MAX, CreateCommentRequest } from '../../../../server/contracts/comments';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { isApiError } from '../../../lib/api-client';
import { formatIsoDateTime } from '../../../lib/dates';
import { errorsFromFailure, formText, validateWith } from '../../../lib/form';
import { useCreateComment } from '../api/create-comment';
import { useDeleteComment } from '../api/delete-comment';
import { useComments } from '../api/list-comments';

export function CommentThread({ captureId, canWrite }: { captureId: string; canWrite: boolean }) {
  const comments = useComments(captureId);
  const formRef = useRef<HTMLFormElement>(null);
  const create = useCreateComment(captureId, { onCreated: () => formRef.current?.reset() });
  const remove = useDeleteComment(captureId);
  const server = create.error ? errorsFromFailure(create.error, ['text']) : { fieldErrors: {}, formError: null };

  const submit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const result = validateWith(CreateCommentRequest, { text: formText(new FormData(e.currentTarget), 'text') });
    if (result.ok) create.mutate(result.data);
  };

  return (
    <section aria-labelledby="comments-heading" className="min-w-0" data-testid="comment-thread">
      <div className="mb-4 flex items-baseline justify-between gap-4 border-b border-rule pb-2.5">
        <h2 id="comments-heading" className="text-lg font-semibold tracking-tight text-ink">
          Discussion
        </h2>
        <span className="text-xs text-ink-faint">one thread per capture, on every analysis of it</span>
      </div>
      {comments.length === 0 ? (
        <p className="text-sm text-ink-faint">No comments yet.</p>
      ) : (
        <ol className="flex flex-col gap-4">
          {comments.map((c) => (
            <li key={c.id} className="border-l-2 border-rule pl-4" data-testid="comment">
              <p className="text-xs text-ink-faint">
                <span className="font-medium text-ink-soft">{c.authorName ?? 'a former member'}</span> · <Mono>{formatIsoDateTime(c.createdAt)}</Mono>
                {c.canDelete && (
                  <>
                    {' · '}
                    <button type="button" className="text-danger hover:underline" onClick={() => remove.mutate(c.id)} disabled={remove.isPending}>
                      delete
                    </button>
                  </>
                )}
              </p>
              <p className="mt-1 text-sm leading-relaxed break-words whitespace-pre-line text-ink">{c.text}</p>
            </li>
          ))}
        </ol>
      )}
      {remove.isError && (
        <p role="alert" className="mt-2 text-xs text-danger">
          {isApiError(remove.error) ? remove.error.message : 'The comment could not be deleted.'}
        </p>
      )}
      {canWrite && (
        <form ref={formRef} onSubmit={submit} noValidate className="mt-5 flex flex-col gap-3">
          <TextAreaField label="Add a comment" name="text" maxLength={COMMENT_TEXT_MAX} required error={server.fieldErrors.text} />
          <FormAlert message={server.formError} />
          <div>
            <Button type="submit" size="sm" busy={create.isPending} busyLabel="Posting…">
              Post comment
            </Button>
          </div>
        </form>
      )}
    </section>
  );
}
