/** Data access for comments (Knex only). Id lookups join the caller's membership of the capture's bench. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface CommentRow {
  id: string;
  capture_id: string;
  author_id: string | null;
  text: string;
  created_at: Date;
}

export interface CommentRowWithAuthor extends CommentRow {
  author_name: string | null;
}

function withAuthor(db: Knex) {
  return db('comments as k').leftJoin('users as u', 'u.id', 'k.author_id').select('k.*', 'u.name as author_name');
}

/** A capture's thread, oldest first. */
export async function listCommentsOfCapture(db: Knex, captureId: string): Promise<CommentRowWithAuthor[]> {
  return withAuthor(db)
    .where('k.capture_id', captureId)
    .orderBy([
      { column: 'k.created_at', order: 'asc' },
      { column: 'k.id', order: 'asc' },
    ]);
}

export async function findCommentWithAuthor(db: Knex, commentId: string): Promise<CommentRowWithAuthor | undefined> {
  return withAuthor(db).where('k.id', commentId).first();
}

/** The comment with its capture's bench and the caller's role there (null: not a member). */
export async function findCommentForUser(
  db: Knex,
  commentId: string,
  userId: string,
): Promise<(CommentRow & { bench_id: string; role: BenchRole | null }) | undefined> {
  return db('comments as k')
    .join('captures as c', 'c.id', 'k.capture_id')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'c.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('k.id', commentId)
    .first('k.*', 'c.bench_id', 'm.role as role');
}

export async function insertComment(db: Knex, row: CommentRow): Promise<void> {
  await db('comments').insert(row);
}

export async function deleteComment(db: Knex, commentId: string): Promise<void> {
  await db('comments').where({ id: commentId }).delete();
}
