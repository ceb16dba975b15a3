/**
 * "Forgot password": a request answers the same way whether or not the address has an account (the
 * e-mail goes out in the background, so the answer's timing does not tell either); the link is
 * single-use and valid for one hour (token: 256 random bits, only its SHA-256 stored). Setting the new
 * password (≥ 12 characters) retires the account's other open links and ends its other sessions.
 */
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { PASSWORD_RESET_VALID_MINUTES, type PasswordResetConfirmRequest, type PasswordResetCheckResponse } from '../../contracts/password-resets';
import { AppError, notFound } from '../../errors';
import { newId } from '../../lib/ids';
import { hashLinkToken, newLinkToken } from '../../mail/link-token';
import type { Mailer } from '../../mail/mailer';
import { passwordResetMail } from '../../mail/messages';
import { hashPassword } from '../auth/password';
import { findUserByEmail } from '../users/users.repository';
import {
  deleteOtherSessions,
  findPasswordResetByTokenHash,
  insertPasswordReset,
  markPasswordResetUsed,
  retireOtherPasswordResets,
  setPasswordHash,
} from './password-resets.repository';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type PasswordResetConfirmInput = Parsed<typeof PasswordResetConfirmRequest>;

export const PASSWORD_RESET_REQUESTED_MESSAGE =
  'if an account has that address, an e-mail with a link to choose a new password is on its way; the link works for one hour';
export const PASSWORD_RESET_UNKNOWN_MESSAGE = 'this password-reset link is not valid; ask for a new one';
export const PASSWORD_RESET_USED_MESSAGE = 'this password-reset link has been used already; ask for a new one';
export const PASSWORD_RESET_EXPIRED_MESSAGE = 'this password-reset link has expired (links work for one hour); ask for a new one';

const gone = (message: string) => new AppError(410, 'gone', message);

export interface PasswordResetsDeps {
  db: Knex;
  mailer: Mailer;
  baseUrl: string;
  logger: Logger;
}

export function createPasswordResetsService({ db, mailer, baseUrl, logger }: PasswordResetsDeps) {
  async function usable(token: string, trx: Knex = db, lock = false) {
    const row = await findPasswordResetByTokenHash(trx, hashLinkToken(token), lock);
    if (!row) throw notFound(PASSWORD_RESET_UNKNOWN_MESSAGE);
    if (row.used_at) throw gone(PASSWORD_RESET_USED_MESSAGE);
    if (new Date(row.expires_at).getTime() <= Date.now()) throw gone(PASSWORD_RESET_EXPIRED_MESSAGE);
    return row;
  }

  /** Starts the work and returns at once; `done` settles when the e-mail went (tests wait on it). */
  function request(email: string): { done: Promise<void> } {
    const done = (async () => {
      const user = await findUserByEmail(db, email);
      if (!user) return;
      const { token, hash } = newLinkToken();
      const now = new Date();
      const expiresAt = new Date(now.getTime() + PASSWORD_RESET_VALID_MINUTES * 60_000);
      await insertPasswordReset(db, { id: newId(), user_id: user.id, token_hash: hash, created_at: now, expires_at: expiresAt, used_at: null });
      await mailer.send(passwordResetMail({ to: user.email, link: `${baseUrl}/reset-password/${token}`, expiresAt }));
    })().catch((err: unknown) => logger.warn({ err }, 'sending a password-reset e-mail failed'));
    return { done };
  }

  return {
    request,

    async check(token: string): Promise<PasswordResetCheckResponse> {
      const row = await usable(token);
      return { email: row.email, expiresAt: new Date(row.expires_at).toISOString() };
    },

    /** Sets the new password; ends every session of the account except `currentSessionId` (when it is the same account's). */
    async confirm(input: PasswordResetConfirmInput, current: { userId: string; sessionId: string } | null): Promise<void> {
      const passwordHash = await hashPassword(input.password);
      await db.transaction(async (trx) => {
        const row = await usable(input.token, trx, true);
        const now = new Date();
        if (!(await markPasswordResetUsed(trx, row.id, now))) throw gone(PASSWORD_RESET_USED_MESSAGE);
        await retireOtherPasswordResets(trx, row.user_id, now);
        await setPasswordHash(trx, row.user_id, passwordHash, now);
        await deleteOtherSessions(trx, row.user_id, current?.userId === row.user_id ? current.sessionId : null);
      });
    },
  };
}

export type PasswordResetsService = ReturnType<typeof createPasswordResetsService>;
