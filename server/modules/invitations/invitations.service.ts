/**
 * Invitations: an owner invites an e-mail address with a role; the e-mail carries a single-use link
 * valid for 7 days (token: 256 random bits, only its SHA-256 stored — mail/link-token.ts). Accepting
 * creates the account (sign-up with the invited address) or adds the membership to the signed-in
 * account with that address. Used or expired → 410 gone and nothing changes. Both ends are recorded
 * in the audit trail.
 */
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { User } from '../../contracts/auth';
import type { BenchRole } from '../../contracts/benches';
import {
  INVITATION_VALID_DAYS,
  type AcceptInvitationRequest,
  type CreateInvitationRequest,
  type Invitation,
  type InvitationPreview,
} from '../../contracts/invitations';
import { AppError, conflict, forbidden, notFound } from '../../errors';
import { isDuplicateKeyError } from '../../lib/db-errors';
import { newId } from '../../lib/ids';
import { hashLinkToken, newLinkToken } from '../../mail/link-token';
import type { Mailer } from '../../mail/mailer';
import { invitationMail } from '../../mail/messages';
import { recordAudit } from '../audit/record-audit';
import { toUser } from '../auth/auth.service';
import { hashPassword } from '../auth/password';
import { assertCan, type BenchAccess } from '../benches/bench-policy';
import { findMember, insertMember } from '../members/members.repository';
import { findUserByEmail, insertUser } from '../users/users.repository';
import {
  findInvitationById,
  findInvitationByTokenHash,
  insertInvitation,
  listInvitations,
  markInvitationAccepted,
  type InvitationByTokenRow,
  type InvitationListRow,
} from './invitations.repository';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type CreateInvitationInput = Parsed<typeof CreateInvitationRequest>;
export type AcceptInvitationInput = Parsed<typeof AcceptInvitationRequest>;

const DAY_MS = 24 * 60 * 60 * 1000;

export const INVITATION_UNKNOWN_MESSAGE = 'this invitation link is not valid; ask the bench owner for a new one';
export const INVITATION_USED_MESSAGE = 'this invitation has been used already; ask the bench owner for a new one';
export const INVITATION_EXPIRED_MESSAGE = 'this invitation has expired (links are valid for 7 days); ask the bench owner for a new one';

const gone = (message: string) => new AppError(410, 'gone', message);

function statusOf(row: InvitationListRow, now: Date): Invitation['status'] {
  if (row.accepted_at) return 'accepted';
  return new Date(row.expires_at).getTime() <= now.getTime() ? 'expired' : 'pending';
}

function toInvitation(row: InvitationListRow, now = new Date()): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    status: statusOf(row, now),
    invitedBy: row.inviter_email ? { name: row.inviter_name ?? '', email: row.inviter_email } : null,
    createdAt: new Date(row.created_at).toISOString(),
    expiresAt: new Date(row.expires_at).toISOString(),
    acceptedAt: row.accepted_at ? new Date(row.accepted_at).toISOString() : null,
  };
}

/** 410 for a used or expired invitation. */
function assertUsable(row: InvitationByTokenRow, now: Date): void {
  if (row.accepted_at) throw gone(INVITATION_USED_MESSAGE);
  if (new Date(row.expires_at).getTime() <= now.getTime()) throw gone(INVITATION_EXPIRED_MESSAGE);
}

export interface InvitationsDeps {
  db: Knex;
  mailer: Mailer;
  /** the site's address for links in e-mail */
  baseUrl: string;
  logger: Logger;
}

export function createInvitationsService({ db, mailer, baseUrl, logger }: InvitationsDeps) {
  async function byToken(token: string, trx: Knex = db, lock = false): Promise<InvitationByTokenRow> {
    const row = await findInvitationByTokenHash(trx, hashLinkToken(token), lock);
    if (!row) throw notFound(INVITATION_UNKNOWN_MESSAGE);
    return row;
  }

  return {
    async create(access: BenchAccess, input: CreateInvitationInput): Promise<{ invitation: Invitation; emailSent: boolean }> {
      assertCan(access, 'members.manage');
      const existing = await findUserByEmail(db, input.email);
      if (existing && (await findMember(db, access.benchId, existing.id))) {
        throw conflict(`${input.email} is already a member of this bench`);
      }
      const { token, hash } = newLinkToken();
      const now = new Date();
      const id = newId();
      await db.transaction(async (trx) => {
        await insertInvitation(trx, {
          id,
          bench_id: access.benchId,
          email: input.email,
          role: input.role as BenchRole,
          token_hash: hash,
          invited_by: access.userId,
          created_at: now,
          expires_at: new Date(now.getTime() + INVITATION_VALID_DAYS * DAY_MS),
          accepted_at: null,
          accepted_by: null,
        });
        await recordAudit(trx, {
          benchId: access.benchId,
          actorId: access.userId,
          action: 'invitation.created',
          targetType: 'invitation',
          targetId: id,
          details: { email: input.email, role: input.role },
        });
      });
      const row = await findInvitationById(db, id);
      if (!row) throw new Error('the invitation just made is missing');
      const bench = await db('benches').where({ id: access.benchId }).first<{ name: string }>('name');
      let emailSent = true;
      try {
        await mailer.send(
          invitationMail({
            to: input.email,
            benchName: bench?.name ?? 'a bench',
            inviterName: row.inviter_name ?? 'A bench owner',
            role: row.role,
            link: `${baseUrl}/invitation/${token}`,
            expiresAt: new Date(row.expires_at),
          }),
        );
      } catch (err) {
        emailSent = false;
        logger.warn({ err, invitationId: id }, 'sending an invitation e-mail failed');
      }
      return { invitation: toInvitation(row), emailSent };
    },

    async list(access: BenchAccess): Promise<Invitation[]> {
      assertCan(access, 'members.manage');
      const now = new Date();
      return (await listInvitations(db, access.benchId)).map((r) => toInvitation(r, now));
    },

    async preview(token: string): Promise<InvitationPreview> {
      const row = await byToken(token);
      assertUsable(row, new Date());
      return {
        benchName: row.bench_name,
        email: row.email,
        role: row.role,
        invitedBy: row.inviter_name,
        expiresAt: new Date(row.expires_at).toISOString(),
        accountExists: Boolean(await findUserByEmail(db, row.email)),
      };
    },

    /**
     * Accepts: `signedIn` is the session's user (or null). Returns the bench and the user; when an
     * account was created the caller signs it in.
     */
    async accept(input: AcceptInvitationInput, signedIn: User | null): Promise<{ benchId: string; user: User; accountCreated: boolean }> {
      // hash the password before the transaction holds its locks
      const passwordHash = !signedIn && input.password ? await hashPassword(input.password) : null;
      return db.transaction(async (trx) => {
        const row = await byToken(input.token, trx, true);
        const now = new Date();
        assertUsable(row, now);
        let user: User;
        let accountCreated = false;
        if (signedIn) {
          if (signedIn.email !== row.email) {
            throw forbidden(`this invitation was sent to ${row.email}; sign in with that address to accept it`);
          }
          user = signedIn;
          if (await findMember(trx, row.bench_id, user.id)) throw conflict('you are already a member of this bench');
        } else {
          if (await findUserByEmail(trx, row.email)) {
            throw conflict(`an account with ${row.email} exists; sign in, then open the invitation link again`);
          }
          if (!input.name || !passwordHash) {
            throw new AppError(400, 'validation_failed', 'give your name and a password to create your account', [
              ...(input.name ? [] : [{ path: 'name', message: 'required to create the account' }]),
              ...(input.password ? [] : [{ path: 'password', message: 'required to create the account' }]),
            ]);
          }
          const created = { id: newId(), email: row.email, name: input.name, password_hash: passwordHash, created_at: now };
          try {
            await insertUser(trx, created);
          } catch (e) {
            if (isDuplicateKeyError(e)) throw conflict(`an account with ${row.email} exists; sign in, then open the invitation link again`);
            throw e;
          }
          user = toUser(created);
          accountCreated = true;
        }
        if (!(await markInvitationAccepted(trx, row.id, user.id, now))) throw gone(INVITATION_USED_MESSAGE);
        await insertMember(trx, { bench_id: row.bench_id, user_id: user.id, role: row.role, joined_at: now });
        await recordAudit(trx, {
          benchId: row.bench_id,
          actorId: user.id,
          action: 'invitation.accepted',
          targetType: 'invitation',
          targetId: row.id,
          details: { email: row.email, role: row.role, accountCreated },
        });
        return { benchId: row.bench_id, user, accountCreated };
      });
    },
  };
}

export type InvitationsService = ReturnType<typeof createInvitationsService>;
