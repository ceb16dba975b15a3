/**
 * Sessions for lucia v3: an implementation of lucia's `Adapter` over Knex (tables sessions and users).
 * Knex only; no rules here.
 */
import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import type { Knex } from 'knex';

interface SessionRow {
  id: string;
  user_id: string;
  expires_at: Date;
}

interface SessionUserRow extends SessionRow {
  email: string;
  name: string;
  created_at: Date;
}

export interface DatabaseUserAttributes {
  email: string;
  name: string;
  created_at: Date;
}

function toDatabaseSession(row: SessionRow): DatabaseSession {
  return { id: row.id, userId: row.user_id, expiresAt: new Date(row.expires_at), attributes: {} };
}

export class KnexSessionAdapter implements Adapter {
  constructor(private readonly db: Knex) {}

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = await this.db<SessionUserRow>('sessions')
      .join('users', 'users.id', 'sessions.user_id')
      .where('sessions.id', sessionId)
      .first(
        'sessions.id',
        'sessions.user_id',
        'sessions.expires_at',
        'users.email',
        'users.name',
        'users.created_at',
      );
    if (!row) return [null, null];
    const user: DatabaseUser = {
      id: row.user_id,
      attributes: { email: row.email, name: row.name, created_at: new Date(row.created_at) },
    };
    return [toDatabaseSession(row), user];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows = await this.db<SessionRow>('sessions').where({ user_id: userId }).select('id', 'user_id', 'expires_at');
    return rows.map(toDatabaseSession);
  }

  async setSession(session: DatabaseSession): Promise<void> {
    await this.db('sessions').insert({ id: session.id, user_id: session.userId, expires_at: session.expiresAt });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.db('sessions').where({ id: sessionId }).update({ expires_at: expiresAt });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.db('sessions').where({ id: sessionId }).delete();
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.db('sessions').where({ user_id: userId }).delete();
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.db('sessions').where('expires_at', '<=', new Date()).delete();
  }
}
