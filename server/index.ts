/**
 * The server process: reads the configuration (a bad variable → one line per problem, exit 1),
 * connects Knex, serves /api and the built client (dist/client) on HOST:PORT, and shuts down
 * gracefully on SIGINT/SIGTERM (stop accepting, finish open requests, close the database pool).
 */
import { existsSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { loadEnv, projectRoot, type Env } from './config/env';
import { createApp } from './app';
import { createDb } from './db/knex';
import { createAnalysisJobs } from './jobs/analysis-jobs';
import { createLogger } from './lib/logger';
import { createSmtpMailer, publicBaseUrl } from './mail/mailer';
import { createNotificationsService } from './mail/notifications/notifications.service';
import { createServices } from './services';
import { LocalDiskStorage } from './storage/local-disk-storage';

function fail(message: string): never {
  process.stderr.write(`phaseloom: error: ${message}\n`);
  process.exit(1);
}

let env: Env;
try {
  env = loadEnv();
} catch (e) {
  // "bad configuration:\nVAR: problem\n…" → one line per bad variable
  const lines = (e as Error).message.split('\n').slice(1);
  for (const line of lines) process.stderr.write(`phaseloom: error: bad configuration: ${line}\n`);
  process.exit(1);
}

const logger = createLogger(env.LOG_LEVEL);
const db = createDb(env);
const clientDir = path.join(projectRoot, 'dist', 'client');
if (!existsSync(path.join(clientDir, 'index.html'))) {
  process.stderr.write('phaseloom: the client is not built (dist/client is missing); serving the API only — run `npm run build`\n');
}
const services = createServices(db);
const storage = new LocalDiskStorage(env.storageDir);
// analyses run in worker threads fed from the database queue (PHASELOOM_WORKERS=0: none in this process)
const mailer = createSmtpMailer(env);
const notices = createNotificationsService({ db, mailer, baseUrl: publicBaseUrl(env), logger });
const onFinished = (analysisId: string) => void notices.analysisFinished(analysisId);
const jobs = createAnalysisJobs({ db, storage, workers: env.PHASELOOM_WORKERS, logger, onFinished });
const app = createApp({ db, env, logger, services, clientDir, storage, onAnalysesQueued: jobs.poke, mailer });

// Expired sessions are refused by lucia anyway; sweep their rows now and then.
const SESSION_SWEEP_MS = 6 * 60 * 60 * 1000;
function sweepSessions(): void {
  services.auth.lucia.deleteExpiredSessions().catch((err) => logger.warn({ err }, 'sweeping expired sessions failed'));
}
const sweeper = setInterval(sweepSessions, SESSION_SWEEP_MS);
sweeper.unref();

const server = app.listen(env.PORT, env.HOST);
server.on('error', async (err: NodeJS.ErrnoException) => {
  await db.destroy().catch(() => undefined);
  if (err.code === 'EADDRINUSE') {
    fail(`port ${env.PORT} on ${env.HOST} is already in use; stop what uses it or set PORT`);
  }
  if (err.code === 'EACCES') fail(`not allowed to listen on ${env.HOST}:${env.PORT}; choose a PORT above 1023`);
  if (err.code === 'EADDRNOTAVAIL') fail(`HOST ${env.HOST} is not an address of this machine`);
  fail(`could not listen on ${env.HOST}:${env.PORT}: ${err.message}`);
});
server.on('listening', () => {
  const { port } = server.address() as AddressInfo;
  logger.debug({ host: env.HOST, port }, 'listening');
  process.stderr.write(`phaseloom: serving on http://${env.HOST}:${port}\n`);
  sweepSessions();
  jobs.start().catch((err) => logger.error({ err }, 'starting the analysis jobs failed'));
});

let stopping = false;
function shutdown(signal: string): void {
  if (stopping) return;
  stopping = true;
  clearInterval(sweeper);
  logger.info({ signal }, 'shutting down');
  // Give open requests a few seconds, then close what is left.
  const force = setTimeout(() => server.closeAllConnections(), 5_000);
  force.unref();
  server.close(async () => {
    clearTimeout(force);
    await jobs.stop().catch((err) => logger.error({ err }, 'stopping the analysis jobs failed'));
    await db.destroy().catch((err) => logger.error({ err }, 'closing the database pool failed'));
    process.exit(0);
  });
  server.closeIdleConnections();
}
process.on('SIGINT', () => shutdown('SIGINT'));
process.on('SIGTERM', () => shutdown('SIGTERM'));
