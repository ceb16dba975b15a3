/**
 * Cross-site request check for state-changing methods (POST, PUT, PATCH, DELETE).
 * - An Origin header (or, without one, a Referer) must name the host the request was sent to (the Host
 *   header) or the host of PHASELOOM_PUBLIC_URL; otherwise 403 `bad_origin`.
 * - A request that carries a cookie but neither header is refused too (browsers send Origin on every
 *   non-GET fetch, so a cookie-authenticated request without one did not come from our pages).
 * - Without cookie, Origin and Referer (a script with no session) the request passes.
 * The session cookie is also SameSite=Lax; this check is the second line.
 */
import type { RequestHandler } from 'express';
import { AppError } from '../errors';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

function hostOf(url: string): string | null {
  try {
    const u = new URL(url);
    if (u.protocol !== 'http:' && u.protocol !== 'https:') return null;
    return u.host.toLowerCase();
  } catch {
    return null;
  }
}

export function originCheck(options: { publicUrl?: string }): RequestHandler {
  const publicHost = options.publicUrl ? hostOf(options.publicUrl) : null;
  return (req, _res, next) => {
    if (!STATE_CHANGING.has(req.method)) return next();
    const origin = req.get('origin');
    const referer = req.get('referer');
    const claimed = origin ?? referer;
    if (claimed === undefined) {
      if (req.headers.cookie) return next(badOrigin('the request has no Origin header'));
      return next();
    }
    const claimedHost = origin === 'null' ? null : hostOf(claimed);
    const requestHost = req.get('host')?.toLowerCase() ?? null;
    if (claimedHost !== null && (claimedHost === requestHost || claimedHost === publicHost)) return next();
    next(badOrigin(`requests from ${origin ?? 'that page'} are not accepted`));
  };
}

function badOrigin(why: string): AppError {
  return new AppError(403, 'bad_origin', `${why}; send state-changing requests from Phaseloom's own pages`);
}
