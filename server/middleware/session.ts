/**
 * Session middleware for /api: validates the session cookie (lucia), re-sends it when lucia extended
 * the session, clears a stale one, and keeps the signed-in user in res.locals for `currentUser()`.
 * A request with `Authorization: Bearer <secret>` is authenticated by that personal API token alone:
 * its cookie is never read (so a cookie cannot ride along on a request that skipped the Origin
 * check, see `unlessBearer`), and an unknown, revoked or expired token is refused with 401.
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Session } from 'lucia';
import type { User } from '../contracts/auth';
import { unauthenticated } from '../errors';
import type { AuthService } from '../modules/auth/auth.service';
import { clearSessionCookie, readSessionCookie, setSessionCookie } from '../modules/auth/session-cookie';

/** A cookie-session caller. */
export interface AuthContext {
  user: User;
  session: Session;
}

/** Whoever made the request: by session cookie (`session`) or by personal API token (`tokenId`). */
export interface Caller {
  user: User;
  session: Session | null;
  tokenId: string | null;
}

/** Resolves a Bearer secret to its user, throwing 401 for an unknown, revoked or expired token. */
export interface BearerAuthenticator {
  authenticate(secret: string): Promise<{ user: User; tokenId: string }>;
}

/** The secret of an `Authorization: Bearer …` header; '' for an empty one; null without that scheme. */
export function bearerSecretOf(req: Request): string | null {
  const header = req.get('authorization');
  if (!header) return null;
  const match = /^Bearer(?:\s+(.*))?$/i.exec(header.trim());
  return match ? (match[1] ?? '').trim() : null;
}

/** Runs `handler` (the Origin check) except on Bearer requests, which are never cookie-authenticated. */
export function unlessBearer(handler: RequestHandler): RequestHandler {
  return (req, res, next) => (bearerSecretOf(req) !== null ? next() : handler(req, res, next));
}

const KEY = 'phaseloomAuth';

export function sessionMiddleware(auth: AuthService, tokens?: BearerAuthenticator): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const secret = bearerSecretOf(req);
    if (secret !== null) {
      if (!secret || !tokens) throw unauthenticated('send a personal API token after "Bearer "');
      const { user, tokenId } = await tokens.authenticate(secret);
      res.locals[KEY] = { user, session: null, tokenId } satisfies Caller;
      return next();
    }
    const sessionId = readSessionCookie(req);
    if (!sessionId) return next();
    const found = await auth.validateSession(sessionId);
    if (!found) {
      clearSessionCookie(req, res);
      return next();
    }
    if (found.session.fresh) setSessionCookie(req, res, found.session);
    res.locals[KEY] = { ...found, tokenId: null } satisfies Caller;
    next();
  };
}

/** The caller, by session or by API token, or null. */
export function callerOf(res: Response): Caller | null {
  return (res.locals[KEY] as Caller | undefined) ?? null;
}

/** The signed-in user and cookie session, or null (also null for requests made with an API token). */
export function authOf(res: Response): AuthContext | null {
  const caller = callerOf(res);
  return caller?.session ? { user: caller.user, session: caller.session } : null;
}

/** The caller (session or API token); throws 401 `unauthenticated` when there is none. */
export function currentAuth(res: Response): Caller {
  const caller = callerOf(res);
  if (!caller) throw unauthenticated();
  return caller;
}

/** Refuses the request with 401 unless someone is signed in. */
export const requireUser: RequestHandler = (_req, res, next) => {
  currentAuth(res);
  next();
};
