/**
 * Upload and serving benchmark (issue 4, part 11). Run by `npm run bench`, never by `npm test`;
 * prints figures and asserts nothing about time.
 *   1. Memory: the server process's resident set while a 1 GiB capture is uploaded (target: it rises
 *      by less than 150 MB — the upload is streamed to storage, never held).
 *   2. Latency of the analysis: from upload complete (the 201) to the analysis done, for the 10⁷-sample
 *      float32 IQ capture at 10 MHz, against the CLI's wall time on the same file (target ≤ 1.5×).
 *   3. Serving: GET /api/analyses/:id/spectrum with 50 concurrent clients (autocannon, 10 s) on the
 *      demo data (target p95 < 50 ms).
 * The server runs as it does in production (`node --import tsx server/index.ts`) in a child process,
 * on the project's MariaDB (scripts/db.sh up), in its own database "<PHASELOOM_DB_NAME>_bench"
 * (dropped and re-created) and storage folder .data/storage-bench. Files go to tests/bench/out/.
 * usage: node --import tsx tests/bench/upload-bench.ts [--skip-rss] [--skip-latency] [--skip-serving]
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createReadStream, createWriteStream, existsSync, mkdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import http from 'node:http';
import { createServer } from 'node:net';
import path from 'node:path';
import { once } from 'node:events';
import autocannon from 'autocannon';
import knexFactory from 'knex';
import { createSynthGenerator } from '../../analysis/synth/generator';
import { loadEnv, projectRoot } from '../../server/config/env';
import { createDb } from '../../server/db/knex';
import { knexConfig } from '../../server/db/knexfile';
import { createCapturesService } from '../../server/modules/captures/captures.service';
import { uploadDemoCaptures } from '../../server/modules/captures/demo-captures';
import { createServices } from '../../server/services';
import { LocalDiskStorage } from '../../server/storage/local-disk-storage';

const args = new Set(process.argv.slice(2));
const outDir = path.join(projectRoot, 'tests', 'bench', 'out');
const storageDir = path.join(projectRoot, '.data', 'storage-bench');
const baseEnv = loadEnv();
const dbName = `${baseEnv.PHASELOOM_DB_NAME}_bench`;
const MiB = 1024 * 1024;
const say = (line: string) => process.stdout.write(`${line}\n`);

// ---- files --------------------------------------------------------------------------------------

/** float32 interleaved I,Q from the engine's synthetic generator (white + flicker FM), block by block. */
async function writeIqFile(file: string, samples: number, sampleRateHz: number, repeatAfter?: number): Promise<void> {
  const gen = createSynthGenerator({ sampleRateHz, output: 'iq', whiteHz2PerHz: 1e4, flickerHz2: 1e8, seed: 3 });
  const out = createWriteStream(file);
  const block = 1 << 19;
  let first: Buffer | null = null;
  for (let done = 0; done < samples; ) {
    const n = Math.min(block, samples - done);
    let bytes: Buffer;
    if (repeatAfter !== undefined && done >= repeatAfter && first && n === block) {
      bytes = first; // a long file of valid samples without generating them all
    } else {
      const { channels } = gen.next(n);
      const f = new Float32Array(2 * n);
      for (let i = 0; i < n; i++) {
        f[2 * i] = channels[0][i];
        f[2 * i + 1] = channels[1][i];
      }
      bytes = Buffer.from(f.buffer);
      if (!first && n === block) first = bytes;
    }
    if (!out.write(bytes)) await once(out, 'drain');
    done += n;
  }
  out.end();
  await once(out, 'finish');
}

// ---- the server ---------------------------------------------------------------------------------

async function freePort(): Promise<number> {
  const srv = createServer();
  srv.listen(0, '127.0.0.1');
  await once(srv, 'listening');
  const { port } = srv.address() as { port: number };
  srv.close();
  return port;
}

interface Server {
  child: ChildProcess;
  base: string;
  port: number;
  stop(): Promise<void>;
}

async function startServer(extraEnv: Record<string, string>): Promise<Server> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: {
      ...process.env,
      NODE_ENV: 'development',
      HOST: '127.0.0.1',
      PORT: String(port),
      PHASELOOM_DB_NAME: dbName,
      PHASELOOM_STORAGE_DIR: storageDir,
      PHASELOOM_MAX_UPLOAD_BYTES: String(2 * 1024 ** 3),
      PHASELOOM_SIGNIN_RATE_LIMIT: '1000',
      PHASELOOM_SIGNUP_RATE_LIMIT: '1000',
      LOG_LEVEL: 'silent',
      ...extraEnv,
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (d) => (stderr += d));
  const base = `http://127.0.0.1:${port}`;
  const end = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the server exited: ${stderr}`);
    try {
      const res = await fetch(`${base}/api/me`);
      if (res.status === 401) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > end) throw new Error(`the server did not answer within 60 s: ${stderr}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    child,
    base,
    port,
    async stop() {
      if (child.exitCode !== null) return;
      child.kill('SIGTERM');
      await once(child, 'exit');
    },
  };
}

function rssBytes(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(/VmRSS:\s+(\d+)\s+kB/.exec(status)?.[1] ?? NaN);
  return kb * 1024;
}

// ---- API calls ----------------------------------------------------------------------------------

/** JSON as the bench reads it: only the fields it looks at. */
type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

interface Session {
  cookie: string;
  origin: string;
}

async function api(server: Server, s: Session | null, method: string, url: string, body?: unknown) {
  const res = await fetch(`${server.base}${url}`, {
    method,
    headers: {
      ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
      ...(s ? { cookie: s.cookie } : {}),
      origin: server.base,
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null, headers: res.headers };
}

async function signIn(server: Server, email: string, password: string, name?: string): Promise<Session> {
  let res = await api(server, null, 'POST', '/api/auth/sign-in', { email, password });
  if (res.status !== 200 && name) res = await api(server, null, 'POST', '/api/auth/sign-up', { email, password, name });
  if (res.status !== 200 && res.status !== 201) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0];
  return { cookie, origin: server.base };
}

/** Streams a multipart upload from disk (never buffered); resolves with status and body when the server answered. */
function uploadFile(server: Server, s: Session, benchId: string, file: string, fields: Record<string, string>) {
  const boundary = `----phaseloom-bench-${Date.now()}`;
  let head = '';
  for (const [k, v] of Object.entries(fields)) {
    head += `--${boundary}\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${v}\r\n`;
  }
  head += `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${path.basename(file)}"\r\nContent-Type: application/octet-stream\r\n\r\n`;
  const tail = `\r\n--${boundary}--\r\n`;
  const size = statSync(file).size;
  return new Promise<{ status: number; body: Json; doneAt: number }>((resolve, reject) => {
    const req = http.request(
      `${server.base}/api/benches/${benchId}/captures`,
      {
        method: 'POST',
        headers: {
          'content-type': `multipart/form-data; boundary=${boundary}`,
          'content-length': Buffer.byteLength(head) + size + Buffer.byteLength(tail),
          cookie: s.cookie,
          origin: server.base,
        },
      },
      (res) => {
        let text = '';
        res.on('data', (d) => (text += d));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text ? JSON.parse(text) : null, doneAt: performance.now() }));
      },
    );
    req.on('error', reject);
    req.write(head);
    const stream = createReadStream(file, { highWaterMark: 1 * MiB });
    stream.pipe(req, { end: false });
    stream.on('end', () => req.end(tail));
    stream.on('error', reject);
  });
}

async function waitDone(server: Server, s: Session, analysisId: string, pollMs = 10): Promise<{ body: Json; at: number }> {
  for (;;) {
    const res = await api(server, s, 'GET', `/api/analyses/${analysisId}`);
    if (res.body.status === 'done' || res.body.status === 'failed') return { body: res.body, at: performance.now() };
    await new Promise((r) => setTimeout(r, pollMs));
  }
}

// ---- the runs -----------------------------------------------------------------------------------

async function freshDatabase(): Promise<void> {
  const config = knexConfig({ ...baseEnv, PHASELOOM_DB_NAME: dbName });
  const server = knexFactory({ ...config, connection: { ...(config.connection as object), database: undefined }, pool: { min: 0, max: 1 } });
  await server.raw('DROP DATABASE IF EXISTS ??', [dbName]);
  await server.raw('CREATE DATABASE ?? CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci', [dbName]);
  await server.destroy();
  const db = knexFactory(config);
  await db.migrate.latest();
  await db.destroy();
}

async function seedDemoData(): Promise<boolean> {
  const seedFile = path.join(projectRoot, 'scripts', 'seed-demo.ts');
  if (!existsSync(seedFile)) return false;
  const r = spawnSync(process.execPath, ['--import', 'tsx', seedFile], {
    cwd: projectRoot,
    env: { ...process.env, NODE_ENV: 'development', PHASELOOM_DB_NAME: dbName, PHASELOOM_STORAGE_DIR: storageDir, LOG_LEVEL: 'silent' },
    encoding: 'utf8',
  });
  if (r.status !== 0) {
    say(`  (the demo seed failed: ${r.stderr.trim().split('\n').pop()})`);
    return false;
  }
  // the demo captures through the captures service (the seed's own hook may do this already; it is idempotent)
  const db = createDb({ ...baseEnv, PHASELOOM_DB_NAME: dbName });
  try {
    const services = createServices(db);
    const mira = await services.auth.findUserByEmail('mira.kestner@example.org');
    const bench = mira && (await services.benches.list(mira.id)).find((b) => b.name === 'Larchmere narrow-linewidth bench');
    if (!mira || !bench) return false;
    const access = await services.benches.resolveAccess(mira.id, bench.id);
    const laserIds = Object.fromEntries((await services.lasers.list(access)).map((l) => [l.name, l.id]));
    const captures = createCapturesService({ db, storage: new LocalDiskStorage(storageDir), lasers: services.lasers });
    await uploadDemoCaptures({ captures, access, laserIds });
  } finally {
    await db.destroy();
  }
  return true;
}

const mb = (bytes: number) => `${(bytes / MiB).toFixed(1)} MB`;

async function rssRun(): Promise<void> {
  say('\n1. Server memory during a 1 GiB upload');
  const file = path.join(outDir, 'upload-1gib-iq.f32');
  if (!existsSync(file) || statSync(file).size !== 1024 * MiB) {
    say('  writing a 1 GiB float32 IQ capture…');
    await writeIqFile(file, (1024 * MiB) / 8, 10e6, 1 << 22);
  }
  // no analyses in this process: the figure is the upload path's alone
  const server = await startServer({ PHASELOOM_WORKERS: '0' });
  try {
    const s = await signIn(server, 'bench.rss@example.org', 'bench-password-2026', 'Bench RSS');
    const bench = await api(server, s, 'POST', '/api/benches', { name: 'RSS bench' });
    await api(server, s, 'GET', `/api/benches/${bench.body.bench.id}/captures`);
    await new Promise((r) => setTimeout(r, 500));
    const before = rssBytes(server.child.pid!);
    let peak = before;
    const timer = setInterval(() => (peak = Math.max(peak, rssBytes(server.child.pid!))), 20);
    const t0 = performance.now();
    const res = await uploadFile(server, s, bench.body.bench.id, file, { kind: 'iq', sampleRateHz: '10000000', format: 'raw', dtype: 'float32', channels: '2' });
    clearInterval(timer);
    peak = Math.max(peak, rssBytes(server.child.pid!));
    const seconds = (res.doneAt - t0) / 1000;
    if (res.status !== 201) throw new Error(`upload failed: ${res.status} ${JSON.stringify(res.body)}`);
    say(`  upload: ${mb(1024 * MiB)} in ${seconds.toFixed(1)} s (${(1024 / seconds).toFixed(0)} MB/s), 201, sha256 ${res.body.capture.sha256.slice(0, 16)}…`);
    say(`  server RSS: ${mb(before)} before, ${mb(peak)} at most during the upload → rise ${mb(peak - before)} (target < 150 MB)`);
    await api(server, s, 'DELETE', `/api/captures/${res.body.capture.id}`);
  } finally {
    await server.stop();
  }
}

async function latencyRun(): Promise<{ server: Server; session: Session; analysisId: string } | null> {
  say('\n2. Upload complete → result, 10⁷-sample float32 IQ at 10 MHz, against the CLI');
  const file = path.join(outDir, 'engine-1e7-iq.f32');
  if (!existsSync(file) || statSync(file).size !== 8e7) {
    say('  writing the 10⁷-sample capture…');
    await writeIqFile(file, 1e7, 10e6);
  }
  const cliArgs = ['--import', 'tsx', 'analysis/cli.ts', file, '--kind', 'iq', '--sample-rate', '10000000', '--format', 'raw', '--dtype', 'float32', '--channels', '2'];
  const cliTimes: number[] = [];
  let cliReport: Json = {};
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    const r = spawnSync(process.execPath, cliArgs, { cwd: projectRoot, encoding: 'utf8', maxBuffer: 64 * MiB });
    cliTimes.push((performance.now() - t0) / 1000);
    if (r.status !== 0) throw new Error(`the CLI failed: ${r.stderr}`);
    cliReport = JSON.parse(r.stdout);
  }
  const server = await startServer({});
  const s = await signIn(server, 'bench.latency@example.org', 'bench-password-2026', 'Bench latency');
  const bench = await api(server, s, 'POST', '/api/benches', { name: 'Latency bench' });
  const fields = { kind: 'iq', sampleRateHz: '10000000', format: 'raw', dtype: 'float32', channels: '2' };
  const serverTimes: number[] = [];
  let analysisId = '';
  let result: Json = {};
  for (let i = 0; i < 3; i++) {
    const up = await uploadFile(server, s, bench.body.bench.id, file, fields);
    if (up.status !== 201) throw new Error(`upload failed: ${up.status} ${JSON.stringify(up.body)}`);
    const done = await waitDone(server, s, up.body.analysis.id);
    if (done.body.status !== 'done') throw new Error(`analysis failed: ${done.body.error}`);
    serverTimes.push((done.at - up.doneAt) / 1000);
    analysisId = up.body.analysis.id;
    result = done.body;
  }
  const best = (xs: number[]) => Math.min(...xs);
  const list = (xs: number[]) => xs.map((x) => x.toFixed(2)).join(', ');
  say(`  CLI (process start to JSON): ${list(cliTimes)} s; best ${best(cliTimes).toFixed(2)} s`);
  say(`  server (201 to status done, polled every 10 ms): ${list(serverTimes)} s; best ${best(serverTimes).toFixed(2)} s`);
  say(`  ratio server/CLI (best of 3 each): ${(best(serverTimes) / best(cliTimes)).toFixed(2)} (target ≤ 1.5)`);
  say(`  same figures: intrinsic linewidth CLI ${cliReport.intrinsicLinewidthHz} Hz, server ${result.intrinsicLinewidthHz} Hz`);
  return { server, session: s, analysisId };
}

/** 50 connections for 10 s; latencies of every response, percentiles computed here (autocannon reports no p95). */
async function load(url: string, cookie: string): Promise<{ p95: number; summary: string }> {
  const latencies: number[] = [];
  let non2xx = 0;
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url, connections: 50, duration: 10, headers: { cookie } }, (err, r) => (err ? reject(err) : resolve(r)));
    instance.on('response', (_client, statusCode, _bytes, responseTime) => {
      latencies.push(responseTime);
      if (statusCode < 200 || statusCode >= 300) non2xx++;
    });
  });
  latencies.sort((a, b) => a - b);
  const pct = (p: number) => latencies[Math.min(latencies.length - 1, Math.floor((p / 100) * latencies.length))];
  return {
    p95: pct(95),
    summary:
      `${latencies.length} requests, ${result.requests.average.toFixed(0)} req/s, ${non2xx} not 2xx; ` +
      `p50 ${pct(50).toFixed(1)} ms, p95 ${pct(95).toFixed(1)} ms, p99 ${pct(99).toFixed(1)} ms`,
  };
}

async function servingRun(fallback: { server: Server; session: Session; analysisId: string } | null): Promise<void> {
  say('\n3. GET /api/analyses/:id/spectrum, 50 concurrent clients, 10 s (autocannon)');
  let server = fallback?.server ?? null;
  let session = fallback?.session ?? null;
  let analysisId = fallback?.analysisId ?? '';
  let source = 'the 10⁷-sample capture of part 2';
  if (server) await server.stop();
  const seeded = await seedDemoData();
  server = await startServer({});
  try {
    if (seeded) {
      const mira = await signIn(server, 'mira.kestner@example.org', 'larchmere-demo-2026');
      const benches = await api(server, mira, 'GET', '/api/benches');
      const demo = benches.body.benches.find((b: { name: string }) => b.name === 'Larchmere narrow-linewidth bench');
      const list = demo ? await api(server, mira, 'GET', `/api/benches/${demo.id}/captures?pageSize=100`) : null;
      const demoAnalyses: string[] = (list?.body.captures ?? []).map((c: Json) => c.latestAnalysis?.id).filter(Boolean);
      if (demoAnalyses.length > 0) {
        for (const id of demoAnalyses) await waitDone(server, mira, id, 100);
        session = mira;
        analysisId = demoAnalyses[0];
        source = `the demo data (${demoAnalyses.length} analysed captures; this one of them)`;
      }
    }
    if (!session || !analysisId) throw new Error('no analysis to serve');
    if (source.startsWith('the 10⁷')) {
      const s = await signIn(server, 'bench.latency@example.org', 'bench-password-2026');
      session = s;
    }
    const url = `${server.base}/api/analyses/${analysisId}/spectrum?view=dbc&points=400`;
    const check = await fetch(url, { headers: { cookie: session.cookie } });
    const body = (await check.json()) as { points: number };
    say(`  serving ${source}: ${body.points} points per reply`);
    const spectrum = await load(url, session.cookie);
    say(`  spectrum: ${spectrum.summary}`);
    say(`  p95 ${spectrum.p95.toFixed(1)} ms (target < 50 ms)`);
    // the same load on the cheapest signed-in route: what every request costs before any spectrum work
    const me = await load(`${server.base}/api/me`, session.cookie);
    say(`  for comparison, GET /api/me under the same load: ${me.summary}`);
  } finally {
    await server.stop();
  }
}

async function main(): Promise<void> {
  mkdirSync(outDir, { recursive: true });
  say(`upload benchmark: database ${dbName}, storage ${path.relative(projectRoot, storageDir)}, ${(await import('node:os')).availableParallelism()} cores`);
  rmSync(storageDir, { recursive: true, force: true });
  await freshDatabase();
  if (!args.has('--skip-rss')) await rssRun();
  const latency = args.has('--skip-latency') ? null : await latencyRun();
  if (!args.has('--skip-serving')) await servingRun(latency);
  else await latency?.server.stop();
  rmSync(storageDir, { recursive: true, force: true });
}

main().catch((e) => {
  process.stderr.write(`upload benchmark failed: ${(e as Error).stack ?? e}\n`);
  process.exitCode = 1;
});
