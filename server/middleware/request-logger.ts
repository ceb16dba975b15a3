/**
 * One pino line per request (pino-http): method, URL, status, time. Quiet by default: server errors
 * at `error`, everything else at `debug` (LOG_LEVEL=debug shows all traffic). Cookies and
 * Set-Cookie never reach the log.
 */
import type { RequestHandler } from 'express';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';

export function requestLogger(logger: Logger): RequestHandler {
  return pinoHttp({
    logger,
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'debug'),
    serializers: {
      req: (req: { method?: string; url?: string }) => ({ method: req.method, url: req.url }),
      res: (res: { statusCode?: number }) => ({ statusCode: res.statusCode }),
    },
  });
}
