/**
 * Writes the session cookie: HttpOnly, SameSite=Lax, Path=/, expiry from lucia, and Secure when the
 * request came over https (req.secure; behind a TLS-terminating proxy set PHASELOOM_TRUST_PROXY so
 * that X-Forwarded-Proto is believed).
 */
import type { Request, Response } from 'express';
import type { Session } from 'lucia';
import { SESSION_COOKIE_NAME } from './lucia';

export function setSessionCookie(req: Request, res: Response, session: Session): void {
  res.cookie(SESSION_COOKIE_NAME, session.id, {
    httpOnly: true,
    sameSite: 'lax',
    path: '/',
    secure: req.secure,
    expires: session.expiresAt,
  });
}

export function clearSessionCookie(req: Request, res: Response): void {
  res.clearCookie(SESSION_COOKIE_NAME, { httpOnly: true, sameSite: 'lax', path: '/', secure: req.secure });
}

/** The session id from the Cookie header, or null. */
export function readSessionCookie(req: Request): string | null {
  const header = req.headers.cookie;
  if (!header) return null;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq < 0) continue;
    if (part.slice(0, eq).trim() === SESSION_COOKIE_NAME) {
      const value = part.slice(eq + 1).trim();
      return value === '' ? null : value;
    }
  }
  return null;
}
