/**
 * Session middleware for /api: validates the session cookie (lucia), re-sends it when lucia extended
 * the session, clears a stale one, and keeps the signed-in user in res.locals for `currentUser()`.
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Session } from 'lucia';
import type { User } from '../contracts/auth';
import { unauthenticated } from '../errors';
import type { AuthService } from '../modules/auth/auth.service';
import { clearSessionCookie, readSessionCookie, setSessionCookie } from '../modules/auth/session-cookie';

export interface AuthContext {
  user: User;
  session: Session;
}

const KEY = 'phaseloomAuth';

export function sessionMiddleware(auth: AuthService): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const sessionId = readSessionCookie(req);
    if (!sessionId) return next();
    const found = await auth.validateSession(sessionId);
    if (!found) {
      clearSessionCookie(req, res);
      return next();
    }
    if (found.session.fresh) setSessionCookie(req, res, found.session);
    res.locals[KEY] = found satisfies AuthContext;
    next();
  };
}

/** The signed-in user and session, or null. */
export function authOf(res: Response): AuthContext | null {
  return (res.locals[KEY] as AuthContext | undefined) ?? null;
}

/** The signed-in user and session; throws 401 `unauthenticated` when there is none. */
export function currentAuth(res: Response): AuthContext {
  const auth = authOf(res);
  if (!auth) throw unauthenticated();
  return auth;
}

/** Refuses the request with 401 unless someone is signed in. */
export const requireUser: RequestHandler = (_req, res, next) => {
  currentAuth(res);
  next();
};
