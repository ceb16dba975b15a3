/**
 * The lucia v3 instance: 30-day sessions (extended by lucia when half has passed), cookie
 * `phaseloom_session`. Cookie attributes are applied by session-cookie.ts (httpOnly, SameSite=Lax,
 * Path=/, Secure when the request came over https).
 */
import { Lucia, TimeSpan } from 'lucia';
import type { Knex } from 'knex';
import { KnexSessionAdapter, type DatabaseUserAttributes } from './auth.repository';

export const SESSION_COOKIE_NAME = 'phaseloom_session';

export function createLucia(db: Knex) {
  return new Lucia(new KnexSessionAdapter(db), {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: { name: SESSION_COOKIE_NAME, expires: true, attributes: { sameSite: 'lax', path: '/' } },
    getUserAttributes: (a) => ({ email: a.email, name: a.name, createdAt: a.created_at }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: DatabaseUserAttributes;
  }
}
