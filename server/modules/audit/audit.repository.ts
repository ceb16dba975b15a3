/**
 * Data access for audit_events (Knex only). Insert and select — nothing else, ever: the trail is
 * append-only (tests/api/audit.test.ts greps server/ for writes other than inserts).
 */
import type { Knex } from 'knex';

export interface AuditEventRow {
  id: string;
  bench_id: string | null;
  actor_id: string | null;
  actor_email: string | null;
  action: string;
  target_type: string | null;
  target_id: string | null;
  details: string | Record<string, unknown> | null;
  created_at: Date;
}

export interface AuditEventListRow extends AuditEventRow {
  actor_name: string | null;
  actor_current_email: string | null;
}

export async function insertAuditEvent(db: Knex, row: AuditEventRow): Promise<void> {
  await db('audit_events').insert(row);
}

export interface AuditFilter {
  benchId: string;
  action?: string;
  actorId?: string;
  from?: Date;
  to?: Date;
  /** Older than this (created_at, id) pair. */
  before?: { at: Date; id: string };
  limit: number;
}

/**
 * The bench's events, newest first: rows recorded on the bench, plus the sign-ins of its current
 * members made since they joined.
 */
export function listAuditEvents(db: Knex, f: AuditFilter): Promise<AuditEventListRow[]> {
  const q = db('audit_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .where((w) =>
      w.where('e.bench_id', f.benchId).orWhere((s) =>
        s
          .whereNull('e.bench_id')
          .where('e.action', 'auth.signed_in')
          .whereExists(
            db('bench_members as m')
              .select(db.raw('1'))
              .whereRaw('m.user_id = e.actor_id')
              .where('m.bench_id', f.benchId)
              .whereRaw('e.created_at >= m.joined_at'),
          ),
      ),
    )
    .select('e.*', 'u.name as actor_name', 'u.email as actor_current_email');
  if (f.action) q.where('e.action', f.action);
  if (f.actorId) q.where('e.actor_id', f.actorId);
  if (f.from) q.where('e.created_at', '>=', f.from);
  if (f.to) q.where('e.created_at', '<', f.to);
  if (f.before) {
    const { at, id } = f.before;
    q.where((w) => w.where('e.created_at', '<', at).orWhere((s) => s.where('e.created_at', at).where('e.id', '<', id)));
  }
  return q
    .orderBy([
      { column: 'e.created_at', order: 'desc' },
      { column: 'e.id', order: 'desc' },
    ])
    .limit(f.limit);
}
