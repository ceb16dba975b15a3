/**
 * Bench and member contracts. Roles: owner (manages members, edits and deletes the bench),
 * analyst (writes lasers, captures, analyses), viewer (reads).
 *   GET    /api/benches                              -> BenchListResponse (benches I belong to)
 *   POST   /api/benches               CreateBenchRequest -> 201 BenchResponse (creator is owner)
 *   GET    /api/benches/:benchId                     -> BenchResponse
 *   PATCH  /api/benches/:benchId      UpdateBenchRequest -> BenchResponse (owner)
 *   DELETE /api/benches/:benchId                     -> 204 (owner)
 *   GET    /api/benches/:benchId/members             -> MemberListResponse
 *   POST   /api/benches/:benchId/members AddMemberRequest -> 201 MemberResponse (owner)
 *   PATCH  /api/benches/:benchId/members/:userId UpdateMemberRequest -> MemberResponse (owner)
 *   DELETE /api/benches/:benchId/members/:userId     -> 204 (owner, or yourself to leave)
 * Non-members get 404 not_found for every bench-scoped route; members without the role 403 forbidden.
 */
import { z } from 'zod';
import { Email } from './auth';
import { DisplayName, FreeText, Id, Timestamp } from './common';

export const BenchRole = z.enum(['owner', 'analyst', 'viewer']);
export type BenchRole = z.infer<typeof BenchRole>;

export const Bench = z.object({
  id: Id,
  name: z.string(),
  description: z.string().nullable(),
  /** The caller's role on this bench. */
  role: BenchRole,
  createdAt: Timestamp,
});
export type Bench = z.infer<typeof Bench>;

export const BenchSummary = Bench.extend({
  memberCount: z.number().int().nonnegative(),
  laserCount: z.number().int().nonnegative(),
});
export type BenchSummary = z.infer<typeof BenchSummary>;

export const BenchListResponse = z.object({ benches: z.array(BenchSummary) });
export type BenchListResponse = z.infer<typeof BenchListResponse>;

export const BenchResponse = z.object({ bench: Bench });
export type BenchResponse = z.infer<typeof BenchResponse>;

export const CreateBenchRequest = z.object({
  name: DisplayName,
  description: FreeText(2000).optional(),
});
export type CreateBenchRequest = z.input<typeof CreateBenchRequest>;

/** PATCH: any subset; `description: null` or "" clears it. */
export const UpdateBenchRequest = z.object({
  name: DisplayName.optional(),
  description: FreeText(2000).nullable().optional(),
});
export type UpdateBenchRequest = z.input<typeof UpdateBenchRequest>;

export const Member = z.object({
  userId: Id,
  email: z.string(),
  name: z.string(),
  role: BenchRole,
  joinedAt: Timestamp,
});
export type Member = z.infer<typeof Member>;

export const MemberListResponse = z.object({ members: z.array(Member) });
export type MemberListResponse = z.infer<typeof MemberListResponse>;

export const MemberResponse = z.object({ member: Member });
export type MemberResponse = z.infer<typeof MemberResponse>;

/** Adds an existing account (404 'no account with that e-mail' otherwise; 409 if already a member). */
export const AddMemberRequest = z.object({
  email: Email,
  role: BenchRole,
});
export type AddMemberRequest = z.input<typeof AddMemberRequest>;

export const UpdateMemberRequest = z.object({ role: BenchRole });
export type UpdateMemberRequest = z.input<typeof UpdateMemberRequest>;
