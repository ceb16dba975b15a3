/**
 * Bench members: list (any member), add an existing account (owner), change a role (owner), remove
 * (owner, or yourself to leave). A bench always keeps at least one owner: the last owner can neither
 * be demoted nor leave (409), checked under row locks.
 */
import type { Knex } from 'knex';
import type { AddMemberRequest, BenchRole, Member, UpdateMemberRequest } from '../../contracts/benches';
import { conflict, notFound } from '../../errors';
import { isDuplicateKeyError } from '../../lib/db-errors';
import { recordAudit } from '../audit/record-audit';
import { assertCan, type BenchAccess } from '../benches/bench-policy';
import { findUserByEmail } from '../users/users.repository';
import {
  deleteMember,
  findMember,
  insertMember,
  listMembers,
  lockOwnersAndMember,
  updateMemberRole,
  type MemberRow,
} from './members.repository';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type AddMemberInput = Parsed<typeof AddMemberRequest>;
export type UpdateMemberInput = Parsed<typeof UpdateMemberRequest>;

export const NO_ACCOUNT_MESSAGE = 'no account with that e-mail';
export const NOT_A_MEMBER_MESSAGE = 'that person is not a member of this bench';
export const LAST_OWNER_DEMOTE_MESSAGE =
  'the last owner of a bench cannot be demoted; make another member owner first';
export const LAST_OWNER_LEAVE_MESSAGE =
  'the last owner cannot leave the bench; make another member owner first, or delete the bench';

function toMember(row: MemberRow): Member {
  return {
    userId: row.user_id,
    email: row.email,
    name: row.name,
    role: row.role,
    joinedAt: new Date(row.joined_at).toISOString(),
  };
}

export function createMembersService(db: Knex) {
  async function getMember(benchId: string, userId: string): Promise<Member> {
    const row = await findMember(db, benchId, userId);
    if (!row) throw notFound(NOT_A_MEMBER_MESSAGE);
    return toMember(row);
  }

  return {
    async list(access: BenchAccess): Promise<Member[]> {
      assertCan(access, 'members.read');
      return (await listMembers(db, access.benchId)).map(toMember);
    },

    async add(access: BenchAccess, input: AddMemberInput): Promise<Member> {
      assertCan(access, 'members.manage');
      const user = await findUserByEmail(db, input.email);
      if (!user) throw notFound(NO_ACCOUNT_MESSAGE);
      try {
        await db.transaction(async (trx) => {
          await insertMember(trx, { bench_id: access.benchId, user_id: user.id, role: input.role, joined_at: new Date() });
          const details = { email: user.email, role: input.role };
          await recordAudit(trx, { benchId: access.benchId, actorId: access.userId, action: 'member.added', targetType: 'member', targetId: user.id, details });
        });
      } catch (e) {
        if (isDuplicateKeyError(e)) throw conflict(`${user.email} is already a member of this bench`);
        throw e;
      }
      return getMember(access.benchId, user.id);
    },

    async changeRole(access: BenchAccess, userId: string, input: UpdateMemberInput): Promise<Member> {
      assertCan(access, 'members.manage');
      await db.transaction(async (trx) => {
        const owners = await lockOwnersAndMember(trx, access.benchId, userId);
        const target = await findMember(trx, access.benchId, userId);
        if (!target) throw notFound(NOT_A_MEMBER_MESSAGE);
        if (target.role === 'owner' && input.role !== 'owner' && owners.length <= 1) {
          throw conflict(LAST_OWNER_DEMOTE_MESSAGE);
        }
        await updateMemberRole(trx, access.benchId, userId, input.role as BenchRole);
        const details = { email: target.email, from: target.role, to: input.role };
        await recordAudit(trx, { benchId: access.benchId, actorId: access.userId, action: 'member.role_changed', targetType: 'member', targetId: userId, details });
      });
      return getMember(access.benchId, userId);
    },

    /** Removes a member; anyone may remove themselves (leave), owners may remove anyone. */
    async remove(access: BenchAccess, userId: string): Promise<void> {
      if (userId !== access.userId) assertCan(access, 'members.manage');
      await db.transaction(async (trx) => {
        const owners = await lockOwnersAndMember(trx, access.benchId, userId);
        const target = await findMember(trx, access.benchId, userId);
        if (!target) throw notFound(NOT_A_MEMBER_MESSAGE);
        if (target.role === 'owner' && owners.length <= 1) throw conflict(LAST_OWNER_LEAVE_MESSAGE);
        await deleteMember(trx, access.benchId, userId);
        const details = { email: target.email, role: target.role, left: userId === access.userId };
        await recordAudit(trx, { benchId: access.benchId, actorId: access.userId, action: 'member.removed', targetType: 'member', targetId: userId, details });
      });
    },
  };
}

export type MembersService = ReturnType<typeof createMembersService>;
