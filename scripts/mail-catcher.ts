/**
 * The development mail catcher as a process: `tsx scripts/mail-catcher.ts` listens on
 * 127.0.0.1:PHASELOOM_SMTP_PORT (default 2525) and keeps every message in PHASELOOM_OUTBOX_DIR
 * (default .data/outbox), where /outbox shows them. scripts/start.sh and scripts/test.sh start and
 * stop it. Refuses to run with NODE_ENV=production.
 */
import { loadEnv } from '../server/config/env';
import { startMailCatcher } from '../server/mail/mail-catcher';
import { outboxDirOf } from '../server/mail/outbox-store';

const env = loadEnv();
if (env.NODE_ENV === 'production') {
  process.stderr.write('phaseloom: the mail catcher is for development and tests; not started with NODE_ENV=production\n');
  process.exit(1);
}
const dir = outboxDirOf(env);
try {
  const catcher = await startMailCatcher({ port: env.PHASELOOM_SMTP_PORT, dir });
  process.stderr.write(`phaseloom: mail catcher on 127.0.0.1:${catcher.port}, keeping messages in ${dir}\n`);
  const stop = () => void catcher.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
} catch (e) {
  const err = e as NodeJS.ErrnoException;
  process.stderr.write(
    err.code === 'EADDRINUSE'
      ? `phaseloom: error: port ${env.PHASELOOM_SMTP_PORT} is already in use (another mail catcher?); set PHASELOOM_SMTP_PORT\n`
      : `phaseloom: error: the mail catcher could not start: ${err.message}\n`,
  );
  process.exit(1);
}
