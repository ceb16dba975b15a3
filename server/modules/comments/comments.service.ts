/**
 * The comment thread of a capture's spectrum (one per capture, shown on every analysis of it): list
 * (any member), add (owner, analyst), delete (the author or an owner). Roles are checked before the
 * body is parsed.
 */
import type { Knex } from 'knex';
import type { Comment, CommentsResponse, CreateCommentRequest } from '../../contracts/comments';
import { newId } from '../../lib/ids';
import type { BenchAccess } from '../benches/bench-policy';
import { accessFromRow, assertCaptureAction, assertIdShape, CAPTURE_NOT_FOUND } from '../captures/capture-policy';
import { findCaptureForUser } from '../captures/captures.repository';
import { assertMayChangeNote, mayChangeNote } from '../marks/mark-policy';
import {
  deleteComment,
  findCommentForUser,
  findCommentWithAuthor,
  insertComment,
  listCommentsOfCapture,
  type CommentRowWithAuthor,
} from './comments.repository';

export const COMMENT_NOT_FOUND = 'no such comment, or it is not on a bench of yours';

function toComment(row: CommentRowWithAuthor, access: BenchAccess): Comment {
  return {
    id: row.id,
    captureId: row.capture_id,
    text: row.text,
    authorId: row.author_id,
    authorName: row.author_name,
    canDelete: mayChangeNote(access, row.author_id),
    createdAt: new Date(row.created_at).toISOString(),
  };
}

export function createCommentsService({ db }: { db: Knex }) {
  async function captureAccess(userId: string, captureId: string): Promise<BenchAccess> {
    assertIdShape(captureId, CAPTURE_NOT_FOUND);
    const capture = await findCaptureForUser(db, captureId, userId);
    return accessFromRow(capture, userId, CAPTURE_NOT_FOUND);
  }

  return {
    async list(userId: string, captureId: string): Promise<CommentsResponse> {
      const access = await captureAccess(userId, captureId);
      assertCaptureAction(access, 'captures.read');
      const rows = await listCommentsOfCapture(db, captureId);
      return { comments: rows.map((r) => toComment(r, access)) };
    },

    async create(userId: string, captureId: string, parse: () => CreateCommentRequest): Promise<Comment> {
      const access = await captureAccess(userId, captureId);
      assertCaptureAction(access, 'captures.write');
      const body = parse();
      const id = newId();
      await insertComment(db, { id, capture_id: captureId, author_id: userId, text: body.text, created_at: new Date() });
      const row = await findCommentWithAuthor(db, id);
      if (!row) throw new Error('the comment vanished right after it was written');
      return toComment(row, access);
    },

    async remove(userId: string, commentId: string): Promise<void> {
      assertIdShape(commentId, COMMENT_NOT_FOUND);
      const row = await findCommentForUser(db, commentId, userId);
      const access = accessFromRow(row, userId, COMMENT_NOT_FOUND);
      assertCaptureAction(access, 'captures.write');
      assertMayChangeNote(access, row!.author_id, 'comments', 'delete');
      await deleteComment(db, commentId);
    },
  };
}

export type CommentsService = ReturnType<typeof createCommentsService>;
