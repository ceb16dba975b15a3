/**
 * Accounts and sessions: sign-up, sign-in (one generic failure for a wrong e-mail or password),
 * sign-out, session validation. Parsed input in (contracts), contract shapes out.
 */
import type { Knex } from 'knex';
import type { Session } from 'lucia';
import type { SignInRequest, SignUpRequest, User } from '../../contracts/auth';
import { AppError, conflict } from '../../errors';
import { isDuplicateKeyError } from '../../lib/db-errors';
import { newId } from '../../lib/ids';
import { recordAudit } from '../audit/record-audit';
import { findUserByEmail, insertUser, type UserRow } from '../users/users.repository';
import { createLucia } from './lucia';
import { dummyPasswordHash, hashPassword, verifyPassword } from './password';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type SignUpInput = Parsed<typeof SignUpRequest>;
export type SignInInput = Parsed<typeof SignInRequest>;

export const INVALID_CREDENTIALS_MESSAGE = 'wrong e-mail or password';

export function toUser(row: Pick<UserRow, 'id' | 'email' | 'name' | 'created_at'>): User {
  return { id: row.id, email: row.email, name: row.name, createdAt: new Date(row.created_at).toISOString() };
}

export function createAuthService(db: Knex) {
  const lucia = createLucia(db);

  async function createAccount(input: SignUpInput): Promise<User> {
    const row = {
      id: newId(),
      email: input.email,
      name: input.name,
      password_hash: await hashPassword(input.password),
      created_at: new Date(),
    };
    try {
      await insertUser(db, row);
    } catch (e) {
      if (isDuplicateKeyError(e)) throw conflict('an account with that e-mail already exists; sign in instead');
      throw e;
    }
    return toUser(row);
  }

  return {
    lucia,

    createAccount,

    /** The account with this (lower-cased) e-mail, or null. */
    async findUserByEmail(email: string): Promise<User | null> {
      const row = await findUserByEmail(db, email.trim().toLowerCase());
      return row ? toUser(row) : null;
    },

    async signUp(input: SignUpInput): Promise<{ user: User; session: Session }> {
      const user = await createAccount(input);
      const session = await lucia.createSession(user.id, {});
      return { user, session };
    },

    async signIn(input: SignInInput): Promise<{ user: User; session: Session }> {
      const row = await findUserByEmail(db, input.email);
      // Verify against a dummy hash when there is no such account: same work, same answer.
      const ok = await verifyPassword(row?.password_hash ?? (await dummyPasswordHash()), input.password);
      if (!row || !ok) throw new AppError(401, 'invalid_credentials', INVALID_CREDENTIALS_MESSAGE);
      const session = await lucia.createSession(row.id, {});
      await recordAudit(db, { benchId: null, actorId: row.id, action: 'auth.signed_in', targetType: 'user', targetId: row.id });
      return { user: toUser(row), session };
    },

    signOut(sessionId: string): Promise<void> {
      return lucia.invalidateSession(sessionId);
    },

    /** The signed-in user for a session id, or null; `session.fresh` means the cookie must be re-sent. */
    async validateSession(sessionId: string): Promise<{ user: User; session: Session } | null> {
      const { user, session } = await lucia.validateSession(sessionId);
      if (!user || !session) return null;
      return {
        user: { id: user.id, email: user.email, name: user.name, createdAt: new Date(user.createdAt).toISOString() },
        session,
      };
    },
  };
}

export type AuthService = ReturnType<typeof createAuthService>;
