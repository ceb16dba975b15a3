/**
 * /api/auth/sign-up, /api/auth/sign-in, /api/auth/sign-out and /api/me.
 * Thin: parse with the contract, call the auth service, set or clear the cookie, shape the reply.
 */
import { Router } from 'express';
import { SignInRequest, SignUpRequest, type UserResponse } from '../../contracts/auth';
import { authOf, currentAuth } from '../../middleware/session';
import type { AuthService } from './auth.service';
import { signInRateLimit, signUpRateLimit, type AuthRateLimits } from './auth-rate-limits';
import { clearSessionCookie, setSessionCookie } from './session-cookie';

export function authRouter(auth: AuthService, limits: AuthRateLimits): Router {
  const router = Router();

  router.post('/auth/sign-up', signUpRateLimit(limits), async (req, res) => {
    const input = SignUpRequest.parse(req.body);
    const { user, session } = await auth.signUp(input);
    setSessionCookie(req, res, session);
    res.status(201).json({ user } satisfies UserResponse);
  });

  router.post('/auth/sign-in', signInRateLimit(limits), async (req, res) => {
    const input = SignInRequest.parse(req.body);
    const { user, session } = await auth.signIn(input);
    setSessionCookie(req, res, session);
    res.json({ user } satisfies UserResponse);
  });

  router.post('/auth/sign-out', async (req, res) => {
    const current = authOf(res);
    if (current) await auth.signOut(current.session.id);
    clearSessionCookie(req, res);
    res.status(204).end();
  });

  router.get('/me', (_req, res) => {
    const { user } = currentAuth(res);
    res.json({ user } satisfies UserResponse);
  });

  return router;
}
