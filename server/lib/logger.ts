/** The process logger: pino at LOG_LEVEL, JSON lines on stdout, secrets redacted. */
import { pino, type Logger } from 'pino';

export function createLogger(level: string): Logger {
  return pino({
    level,
    base: { app: 'phaseloom' },
    redact: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]', '*.password'],
  });
}
