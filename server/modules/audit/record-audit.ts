/**
 * recordAudit(db | trx, event): appends one row to the bench's audit trail. This is the one way any
 * module writes the trail; pass the transaction of the change being recorded so that the row commits
 * (or rolls back) with it.
 *
 *   import { recordAudit } from '../audit/record-audit';
 *   await recordAudit(trx, {
 *     benchId,                       // the bench the event belongs to (null: a person's own event, e.g. a sign-in)
 *     actorId: user.id,              // who did it (null: the system)
 *     action: 'share_link.created',  // one of AuditAction in server/contracts/audit.ts
 *     targetType: 'share_link',      // one of AuditTargetType (or null)
 *     targetId: link.id,             // the thing's id (or null)
 *     details: { analysisId, expiresAt }, // small JSON object shown on the audit page (optional)
 *   });
 *
 * Rows are never updated or deleted by the app (tests/api/audit.test.ts greps server/ for it).
 */
import type { Knex } from 'knex';
import type { AuditAction, AuditTargetType } from '../../contracts/audit';
import { newId } from '../../lib/ids';
import { insertAuditEvent } from './audit.repository';

export interface AuditEventInput {
  benchId: string | null;
  actorId: string | null;
  action: AuditAction;
  targetType?: AuditTargetType | null;
  targetId?: string | null;
  details?: Record<string, unknown> | null;
}

export async function recordAudit(db: Knex | Knex.Transaction, event: AuditEventInput): Promise<void> {
  let actorEmail: string | null = null;
  if (event.actorId) {
    const row = await db('users').where({ id: event.actorId }).first<{ email: string } | undefined>('email');
    actorEmail = row?.email ?? null;
  }
  await insertAuditEvent(db, {
    id: newId(),
    bench_id: event.benchId,
    actor_id: event.actorId,
    actor_email: actorEmail,
    action: event.action,
    target_type: event.targetType ?? null,
    target_id: event.targetId ?? null,
    details: event.details ? JSON.stringify(event.details) : null,
    created_at: new Date(),
  });
}
