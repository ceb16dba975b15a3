/**
 * Personal API tokens: made (the secret returned once), listed (never the secret), revoked, and
 * resolved from an `Authorization: Bearer` secret to the user it acts for.
 * A secret is "plm_" + 256 random bits from the CSPRNG in lower-case base32 (52 characters); the
 * server keeps its sha256 (hex) and its first 12 characters in clear. The secret has 256 bits of
 * entropy, so one unsalted sha256 is enough (no password stretching: nothing to guess).
 */
import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { User } from '../../contracts/auth';
import {
  API_TOKEN_SECRET_PREFIX,
  API_TOKEN_VISIBLE_CHARS,
  type ApiToken,
  type CreatedApiTokenResponse,
} from '../../contracts/api-tokens';
import { AppError, notFound, unauthenticated } from '../../errors';
import { encodeBase32, newId } from '../../lib/ids';
import {
  findApiTokenByHash,
  insertApiToken,
  listActiveApiTokens,
  revokeApiToken,
  touchApiToken,
  type ApiTokenRow,
} from './api-tokens.repository';

/** last_used_at is written at most this often per token (a script may send many requests a second). */
const LAST_USED_RESOLUTION_MS = 60_000;

export function hashApiTokenSecret(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}

export function newApiTokenSecret(): string {
  return API_TOKEN_SECRET_PREFIX + encodeBase32(randomBytes(32));
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

function toApiToken(row: ApiTokenRow): ApiToken {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    createdAt: new Date(row.created_at).toISOString(),
    expiresAt: iso(row.expires_at),
    lastUsedAt: iso(row.last_used_at),
  };
}

export function createApiTokensService(db: Knex, now: () => Date = () => new Date()) {
  return {
    async list(userId: string): Promise<ApiToken[]> {
      return (await listActiveApiTokens(db, userId)).map(toApiToken);
    },

    async create(userId: string, input: { name: string; expiresAt?: string }): Promise<CreatedApiTokenResponse> {
      const created = now();
      const expiresAt = input.expiresAt ? new Date(input.expiresAt) : null;
      if (expiresAt && expiresAt.getTime() <= created.getTime()) {
        throw new AppError(400, 'validation_failed', 'check this field: expiresAt', [
          { path: 'expiresAt', message: 'must be in the future' },
        ]);
      }
      const secret = newApiTokenSecret();
      const row = {
        id: newId(),
        user_id: userId,
        name: input.name,
        prefix: secret.slice(0, API_TOKEN_VISIBLE_CHARS),
        secret_hash: hashApiTokenSecret(secret),
        created_at: created,
        expires_at: expiresAt,
      };
      await insertApiToken(db, row);
      return { token: toApiToken({ ...row, last_used_at: null, revoked_at: null }), secret };
    },

    async revoke(userId: string, id: string): Promise<void> {
      if (!(await revokeApiToken(db, userId, id, now()))) throw notFound('no such API token (it may be revoked already)');
    },

    /**
     * The user a Bearer secret acts for, and the token's id; 401 with the reason when the secret is
     * unknown, revoked or expired. Records the use (at most once a minute per token).
     */
    async authenticate(secret: string): Promise<{ user: User; tokenId: string }> {
      const row = await findApiTokenByHash(db, hashApiTokenSecret(secret));
      if (!row) throw unauthenticated('this API token is not valid; check that it was copied whole, or make a new one on the account page');
      const at = now();
      if (row.revoked_at) throw unauthenticated(`this API token ("${row.name}", ${row.prefix}…) was revoked; make a new one on the account page`);
      if (row.expires_at && new Date(row.expires_at).getTime() <= at.getTime()) {
        throw unauthenticated(`this API token ("${row.name}", ${row.prefix}…) expired at ${new Date(row.expires_at).toISOString()}; make a new one on the account page`);
      }
      if (!row.last_used_at || at.getTime() - new Date(row.last_used_at).getTime() >= LAST_USED_RESOLUTION_MS) {
        await touchApiToken(db, row.id, at);
      }
      return {
        user: { id: row.user_id, email: row.email, name: row.user_name, createdAt: new Date(row.user_created_at).toISOString() },
        tokenId: row.id,
      };
    },
  };
}

export type ApiTokensService = ReturnType<typeof createApiTokensService>;
