/**
 * Configuration: every environment variable the server reads, parsed once with zod at boot.
 * A wrong value stops the process with one line per bad variable.
 */
import { readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

export const projectRoot = path.resolve(import.meta.dirname, '..', '..');

const port = z.coerce.number().int().min(1).max(65535);

const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: port.default(8080),
  PHASELOOM_PUBLIC_URL: z.url().optional(),
  PHASELOOM_DB_HOST: z.string().min(1).default('127.0.0.1'),
  PHASELOOM_DB_PORT: port.default(3307),
  PHASELOOM_DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only').default('phaseloom'),
  PHASELOOM_DB_USER: z.string().min(1).default('phaseloom'),
  PHASELOOM_DB_PASSWORD: z.string().optional(),
  PHASELOOM_DB_DATADIR: z.string().default('.data/mariadb'),
  PHASELOOM_STORAGE_DIR: z.string().default('storage'),
  PHASELOOM_MAX_UPLOAD_BYTES: z.coerce.number().int().positive().default(2 * 1024 ** 3),
  PHASELOOM_SMTP_HOST: z.string().default('127.0.0.1'),
  PHASELOOM_SMTP_PORT: port.default(2525),
  PHASELOOM_MAIL_FROM: z.string().default('Phaseloom <no-reply@phaseloom.invalid>'),
  // SMTP for production: implicit TLS (port 465) and a login; the outbox folder the dev mail catcher fills.
  PHASELOOM_SMTP_SECURE: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  PHASELOOM_SMTP_USER: z.string().optional(),
  PHASELOOM_SMTP_PASSWORD: z.string().optional(),
  PHASELOOM_OUTBOX_DIR: z.string().default('.data/outbox'),
  PHASELOOM_WORKERS: z.coerce.number().int().min(0).optional(),
  // Express 'trust proxy': false (default; req.ip and https come from the socket), true, a hop count,
  // or addresses/subnets ('loopback', '10.0.0.0/8'). Set it when a reverse proxy terminates TLS so that
  // the session cookie gets Secure and rate limits see the client's address.
  PHASELOOM_TRUST_PROXY: z
    .string()
    .default('false')
    .transform((v): boolean | number | string =>
      v === 'false' ? false : v === 'true' ? true : /^\d+$/.test(v) ? Number(v) : v,
    ),
  // Sign-in attempts per IP address and e-mail, and sign-ups per IP address, in one window.
  PHASELOOM_SIGNIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  PHASELOOM_SIGNUP_RATE_LIMIT: z.coerce.number().int().min(1).default(20),
  PHASELOOM_AUTH_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export type Env = z.infer<typeof EnvSchema> & { dbPassword: string; storageDir: string };

/** Parses the environment; throws an Error whose message lists every bad variable, one per line. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`bad configuration:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  const resolve = (p: string) => (path.isAbsolute(p) ? p : path.join(projectRoot, p));
  let dbPassword = env.PHASELOOM_DB_PASSWORD ?? '';
  if (!env.PHASELOOM_DB_PASSWORD) {
    // scripts/db.sh generates the local password on first use, beside the data folder.
    const secretFile = `${resolve(env.PHASELOOM_DB_DATADIR)}.secret`;
    if (existsSync(secretFile)) dbPassword = readFileSync(secretFile, 'utf8').trim();
  }
  return { ...env, dbPassword, storageDir: resolve(env.PHASELOOM_STORAGE_DIR) };
}
