/**
 * Bench-scoped requests: `loadBenchAccess` loads the caller's membership of :benchId on the server
 * (404 `not_found` for non-members — a bench's existence is never revealed); `allow(action)` refuses
 * members whose role lacks the action with 403 `forbidden`, before the body is looked at.
 */
import type { RequestHandler, Response } from 'express';
import { assertCan, type BenchAccess, type BenchAction } from '../modules/benches/bench-policy';
import type { BenchesService } from '../modules/benches/benches.service';
import { currentAuth } from './session';

const KEY = 'phaseloomBenchAccess';

export function loadBenchAccess(benches: BenchesService): RequestHandler<{ benchId: string }> {
  return async (req, res, next) => {
    const { user } = currentAuth(res);
    res.locals[KEY] = await benches.resolveAccess(user.id, req.params.benchId);
    next();
  };
}

export function benchAccessOf(res: Response): BenchAccess {
  const access = res.locals[KEY] as BenchAccess | undefined;
  if (!access) throw new Error('bench access was not loaded for this route (mount loadBenchAccess first)');
  return access;
}

export function allow(action: BenchAction): RequestHandler {
  return (_req, res, next) => {
    assertCan(benchAccessOf(res), action);
    next();
  };
}
