/**
 * The audit trail, read side: owners list their bench's events with filters (action, person, date
 * range), newest first, a page at a time. Writing is recordAudit() in record-audit.ts.
 */
import type { Knex } from 'knex';
import type { AuditAction, AuditEvent, AuditListQuery, AuditListResponse, AuditTargetType } from '../../contracts/audit';
import { forbidden } from '../../errors';
import type { BenchAccess } from '../benches/bench-policy';
import { listAuditEvents, type AuditEventListRow } from './audit.repository';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type AuditListInput = Parsed<typeof AuditListQuery>;

export const AUDIT_OWNERS_ONLY_MESSAGE = `only the bench's owners can read its audit trail`;

function parseDetails(raw: AuditEventListRow['details']): Record<string, unknown> | null {
  if (raw === null) return null;
  if (typeof raw === 'string') {
    try {
      const v: unknown = JSON.parse(raw);
      return v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : null;
    } catch {
      return null;
    }
  }
  return raw;
}

function toEvent(row: AuditEventListRow): AuditEvent {
  return {
    id: row.id,
    benchId: row.bench_id,
    actor: { id: row.actor_id, email: row.actor_current_email ?? row.actor_email, name: row.actor_name },
    action: row.action as AuditAction,
    targetType: row.target_type as AuditTargetType | null,
    targetId: row.target_id,
    details: parseDetails(row.details),
    at: new Date(row.created_at).toISOString(),
  };
}

export function createAuditService(db: Knex) {
  return {
    async list(access: BenchAccess, query: AuditListInput): Promise<AuditListResponse> {
      if (access.role !== 'owner') throw forbidden(AUDIT_OWNERS_ONLY_MESSAGE);
      let before: { at: Date; id: string } | undefined;
      if (query.before) {
        const [at, id] = query.before.split('~');
        before = { at: new Date(at), id };
      }
      const rows = await listAuditEvents(db, {
        benchId: access.benchId,
        action: query.action,
        actorId: query.actorId,
        from: query.from ? new Date(query.from) : undefined,
        to: query.to ? new Date(query.to) : undefined,
        before,
        limit: query.limit + 1,
      });
      const page = rows.slice(0, query.limit).map(toEvent);
      const last = page.at(-1);
      return { events: page, nextBefore: rows.length > query.limit && last ? `${last.at}~${last.id}` : null };
    },
  };
}

export type AuditService = ReturnType<typeof createAuditService>;
