/**
 * The outbox: e-mail caught by the local mail catcher (development and test only; 404 when
 * NODE_ENV=production).
 *   GET /api/outbox?to=  -> OutboxListResponse (newest first, at most 200)
 */
import { z } from 'zod';
import { Timestamp } from './common';

export const OutboxMessage = z.object({
  id: z.string(),
  receivedAt: Timestamp,
  /** SMTP envelope recipients */
  recipients: z.array(z.string()),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
});
export type OutboxMessage = z.infer<typeof OutboxMessage>;

export const OutboxListQuery = z.object({
  /** only messages to this address (case-insensitive) */
  to: z.string().trim().toLowerCase().max(254).optional(),
});

export const OutboxListResponse = z.object({ messages: z.array(OutboxMessage) });
export type OutboxListResponse = z.infer<typeof OutboxListResponse>;
