/**
 * Audit trail contracts (owner only; analysts and viewers 403, outsiders 404).
 *   GET /api/benches/:benchId/audit?action=&actorId=&from=&to=&limit=&before=  -> AuditListResponse
 * `from`/`to` are ISO timestamps (inclusive from, exclusive to); `before` is the `nextBefore` of the
 * previous page. Newest first.
 */
import { z } from 'zod';
import { Id, Timestamp } from './common';

/** Every action the app records. Share links are recorded by the share-links module. */
export const AuditAction = z.enum([
  'auth.signed_in',
  'capture.uploaded',
  'capture.deleted',
  'analysis.created',
  'analysis.retried',
  'member.added',
  'member.role_changed',
  'member.removed',
  'invitation.created',
  'invitation.accepted',
  'share_link.created',
  'share_link.revoked',
]);
export type AuditAction = z.infer<typeof AuditAction>;

/** What the row is about. */
export const AuditTargetType = z.enum(['user', 'capture', 'analysis', 'member', 'invitation', 'share_link', 'overlay', 'bench']);
export type AuditTargetType = z.infer<typeof AuditTargetType>;

export const AuditEvent = z.object({
  id: Id,
  benchId: Id.nullable(),
  actor: z.object({ id: Id.nullable(), email: z.string().nullable(), name: z.string().nullable() }),
  action: AuditAction,
  targetType: AuditTargetType.nullable(),
  targetId: z.string().nullable(),
  details: z.record(z.string(), z.unknown()).nullable(),
  at: Timestamp,
});
export type AuditEvent = z.infer<typeof AuditEvent>;

export const AUDIT_PAGE_MAX = 200;

export const AuditListQuery = z.object({
  action: AuditAction.optional(),
  actorId: Id.optional(),
  from: Timestamp.optional(),
  to: Timestamp.optional(),
  limit: z.coerce.number().int().min(1).max(AUDIT_PAGE_MAX).default(100),
  /** Cursor: the `nextBefore` of the previous page. */
  before: z.string().regex(/^\d{4}-\d\d-\d\dT[\d:.]+Z~[a-z2-7]{24}$/, 'not a page cursor').optional(),
});
export type AuditListQuery = z.input<typeof AuditListQuery>;

export const AuditListResponse = z.object({
  events: z.array(AuditEvent),
  /** Pass as `before` to read the next (older) page; null on the last page. */
  nextBefore: z.string().nullable(),
});
export type AuditListResponse = z.infer<typeof AuditListResponse>;
