/**
 * Harness of the browser tests (vitest project 'e2e'):
 *  - makes sure the client is built into dist/client (runs `vite build` when index.html is missing;
 *    `npm test` builds it before this runs);
 *  - migrates the test database and starts the real server (`node --import tsx server/index.ts`) on a
 *    free port with NODE_ENV=test and the test database variables from the environment
 *    (defaults: PHASELOOM_DB_PORT=3309, PHASELOOM_DB_DATADIR=.data/mariadb-test,
 *    PHASELOOM_DB_NAME=phaseloom_test), and waits until GET /api/me answers;
 *  - launches Debian's chromium through playwright-core with a fresh user-data folder.
 * Never downloads a browser.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const projectRoot = path.resolve(import.meta.dirname, '..', '..');
export const screenshotDir = path.join(projectRoot, 'test-results', 'e2e');

const CHROMIUM = '/usr/bin/chromium';
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];

/** The server's environment: ours, with the test database defaults filled in. */
function serverEnv(port: number): NodeJS.ProcessEnv {
  const env = process.env;
  return {
    ...env,
    NODE_ENV: 'test',
    HOST: '127.0.0.1',
    PORT: String(port),
    PHASELOOM_DB_PORT: env.PHASELOOM_DB_PORT ?? '3309',
    PHASELOOM_DB_DATADIR: env.PHASELOOM_DB_DATADIR ?? '.data/mariadb-test',
    PHASELOOM_DB_NAME: env.PHASELOOM_DB_NAME ?? 'phaseloom_test',
    PHASELOOM_STORAGE_DIR: env.PHASELOOM_STORAGE_DIR ?? '.data/storage-test',
    PHASELOOM_SMTP_PORT: env.PHASELOOM_SMTP_PORT ?? '2526',
    LOG_LEVEL: env.LOG_LEVEL ?? 'silent',
  };
}

function run(command: string, args: string[], env: NodeJS.ProcessEnv, what: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { cwd: projectRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout.on('data', (d) => (output += d));
    child.stderr.on('data', (d) => (output += d));
    child.on('error', reject);
    child.on('exit', (code) =>
      code === 0 ? resolve() : reject(new Error(`${what} failed (exit ${code}):\n${output.slice(-4000)}`)),
    );
  });
}

/** Builds the client unless dist/client/index.html is there already. */
export async function ensureClientBuilt(): Promise<void> {
  if (existsSync(path.join(projectRoot, 'dist', 'client', 'index.html'))) return;
  await run(process.execPath, [path.join(projectRoot, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn'], process.env, 'vite build');
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

export interface E2eServer {
  baseUrl: string;
  /** what the server wrote so far (for failure messages) */
  output: () => string;
  stop: () => Promise<void>;
}

/** Migrates the test database, starts server/index.ts on a free port and waits for GET /api/me. */
export async function startE2eServer(): Promise<E2eServer> {
  await ensureClientBuilt();
  const port = await freePort();
  const env = serverEnv(port);
  await run(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts'], env, 'migrating the test database');

  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  let exited: number | null = null;
  child.on('exit', (code) => (exited = code ?? -1));

  const baseUrl = `http://127.0.0.1:${port}`;
  const stop = async () => {
    if (exited !== null) return;
    await new Promise<void>((resolve) => {
      const force = setTimeout(() => child.kill('SIGKILL'), 8_000);
      child.once('exit', () => {
        clearTimeout(force);
        resolve();
      });
      child.kill('SIGTERM');
    });
  };

  const deadline = Date.now() + 90_000;
  for (;;) {
    if (exited !== null) throw new Error(`the server exited (code ${exited}) before answering:\n${output.slice(-4000)}`);
    try {
      const res = await fetch(`${baseUrl}/api/me`);
      if (res.status === 200 || res.status === 401) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      await stop();
      throw new Error(`the server did not answer GET /api/me within 90 s:\n${output.slice(-4000)}`);
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return { baseUrl, output: () => output, stop };
}

export interface E2eBrowser {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

/** Debian's chromium with a fresh user-data folder, through playwright-core. */
export async function launchBrowser(viewport = { width: 1280, height: 800 }): Promise<E2eBrowser> {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing; install Debian's chromium (npm test does)`);
  const userDataDir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-e2e-'));
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport,
    locale: 'en-GB',
    timezoneId: 'UTC',
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(userDataDir, { recursive: true, force: true });
    },
  };
}

/**
 * Screenshots of the current page at 1280×800 and 1024×768 (full page), into test-results/e2e/,
 * then back to 1280×800. For people to look at; the tests do not compare pixels.
 */
export async function screenshots(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  for (const [width, height] of [
    [1280, 800],
    [1024, 768],
  ]) {
    await page.setViewportSize({ width, height });
    await page.screenshot({ path: path.join(screenshotDir, `${name}-${width}.png`), fullPage: true });
  }
  await page.setViewportSize({ width: 1280, height: 800 });
}
