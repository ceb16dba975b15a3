/**
 * Comment contracts. One thread per capture: the discussion of its spectrum, shown on every analysis
 * of the capture (like its marks).
 *   GET    /api/captures/:captureId/comments  -> CommentsResponse, oldest first (any member of the bench)
 *   POST   /api/captures/:captureId/comments  CreateCommentRequest -> 201 CommentResponse (owner, analyst)
 *   DELETE /api/comments/:id                   -> 204 (its author, or an owner)
 * Viewers get 403 forbidden on writes; members of other benches get 404 not_found for every id.
 */
import { z } from 'zod';
import { Id, Timestamp } from './common';

export const COMMENT_TEXT_MAX = 4000;

export const CreateCommentRequest = z.strictObject({
  text: z
    .string({ error: 'must be text' })
    .trim()
    .min(1, 'must not be empty')
    .max(COMMENT_TEXT_MAX, `must be at most ${COMMENT_TEXT_MAX} characters`),
});
export type CreateCommentRequest = z.infer<typeof CreateCommentRequest>;

export const Comment = z.object({
  id: Id,
  captureId: Id,
  text: z.string(),
  authorId: Id.nullable(),
  authorName: z.string().nullable(),
  /** the caller may delete it (its author, or an owner of the bench) */
  canDelete: z.boolean(),
  createdAt: Timestamp,
});
export type Comment = z.infer<typeof Comment>;

export const CommentsResponse = z.object({ comments: z.array(Comment) });
export type CommentsResponse = z.infer<typeof CommentsResponse>;

export const CommentResponse = z.object({ comment: Comment });
export type CommentResponse = z.infer<typeof CommentResponse>;
