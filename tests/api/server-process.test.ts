/**
 * server/index.ts as a process: bad configuration, a port already in use, serving, and a graceful
 * stop on SIGTERM. Each test starts `node --import tsx server/index.ts` on a free port.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { projectRoot } from '../../server/config/env';

const running: ChildProcess[] = [];
afterEach(() => {
  for (const child of running.splice(0)) if (child.exitCode === null) child.kill('SIGKILL');
});

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

function startServer(env: Record<string, string>) {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: { ...process.env, LOG_LEVEL: 'silent', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  running.push(child);
  let stderr = '';
  let stdout = '';
  child.stderr!.on('data', (d) => (stderr += d));
  child.stdout!.on('data', (d) => (stdout += d));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  const ready = new Promise<void>((resolve, reject) => {
    const check = () => (stderr.includes('serving on') ? resolve() : undefined);
    child.stderr!.on('data', check);
    child.on('exit', () => reject(new Error(`server exited early: ${stderr}`)));
  });
  return { child, exited, ready, out: () => ({ stderr, stdout }) };
}

describe('server/index.ts', () => {
  it('stops with one line per bad variable and exit status 1', () => {
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: projectRoot,
      env: { ...process.env, PORT: 'eighty', LOG_LEVEL: 'loud' },
      encoding: 'utf8',
    });
    expect(run.status).toBe(1);
    const lines = run.stderr.trim().split('\n');
    expect(lines).toHaveLength(2);
    expect(lines[0]).toMatch(/^phaseloom: error: bad configuration: PORT: /);
    expect(lines[1]).toMatch(/^phaseloom: error: bad configuration: LOG_LEVEL: /);
  });

  it('says the port is in use in one line and exits 1', async () => {
    const port = await freePort();
    const blocker = net.createServer();
    await new Promise<void>((r) => blocker.listen(port, '127.0.0.1', r));
    try {
      const server = startServer({ PORT: String(port), HOST: '127.0.0.1' });
      server.ready.catch(() => undefined);
      expect(await server.exited).toBe(1);
      expect(server.out().stderr.trim().split('\n').at(-1)).toBe(
        `phaseloom: error: port ${port} on 127.0.0.1 is already in use; stop what uses it or set PORT`,
      );
    } finally {
      blocker.close();
    }
  });

  it('serves /api on HOST:PORT and exits 0 on SIGTERM', async () => {
    const port = await freePort();
    const server = startServer({ PORT: String(port), HOST: '127.0.0.1' });
    await server.ready;
    const res = await fetch(`http://127.0.0.1:${port}/api/me`);
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: 'unauthenticated', message: 'sign in first' } });
    server.child.kill('SIGTERM');
    expect(await server.exited).toBe(0);
    expect(server.out().stdout).toBe(''); // LOG_LEVEL=silent: nothing on stdout
  });
});
