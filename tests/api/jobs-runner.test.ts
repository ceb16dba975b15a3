/**
 * The job runner over the real analyses table: stale rows re-queued on start, a crashing worker fails
 * only its job, an engine input error is recorded verbatim, two runners never run the same job,
 * progress is throttled, stop() puts running jobs back in the queue.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Knex } from 'knex';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/config/env';
import { createDb } from '../../server/db/knex';
import type { AnalysisExecutor, AnalysisOutcome, AnalysisTask, ProgressUpdate } from '../../server/jobs/analysis-task';
import { JobRunner } from '../../server/jobs/runner';
import { createWorkerPool } from '../../server/jobs/worker-pool';
import { newId } from '../../server/lib/ids';
import { LocalDiskStorage } from '../../server/storage/local-disk-storage';
import { closeTestDb, testDb } from '../helpers/api-app';

const storage = new LocalDiskStorage(loadEnv().storageDir);

const okOutcome = (task: AnalysisTask): AnalysisOutcome => ({
  ok: true,
  result: { input: { kind: task.input.kind }, intrinsicLinewidthHz: 1 },
  figures: { intrinsicLinewidthHz: 1, betaLinewidthHz: 2, lineshapeFwhmHz: 3, whiteFloorHz2PerHz: 1 / Math.PI },
  displaySeries: { frequencyHz: [1, 10], frequencyNoiseHz2PerHz: [2, 2] },
  seriesKey: null,
});

/** An in-process executor that records every task it was given. */
function recordingExecutor(options: { size?: number; delayMs?: () => number; runs?: Map<string, number> } = {}) {
  const runs = options.runs ?? new Map<string, number>();
  const executor: AnalysisExecutor & { runs: Map<string, number> } = {
    size: options.size ?? 2,
    runs,
    async run(task) {
      runs.set(task.analysisId, (runs.get(task.analysisId) ?? 0) + 1);
      await new Promise((r) => setTimeout(r, options.delayMs?.() ?? 5));
      return okOutcome(task);
    },
    async close() {},
  };
  return executor;
}

let db: Knex;
let benchId: string;

async function insertCapture(): Promise<string> {
  const id = newId();
  await db('captures').insert({
    id,
    bench_id: benchId,
    file_name: 'runner.raw',
    storage_key: `captures/${benchId}/${id}`,
    size_bytes: 16,
    sha256: '0'.repeat(64),
    format: 'raw',
    kind: 'iq',
    sample_rate_hz: 1000,
    dtype: 'float32',
    channels: 2,
    byte_order: 'little',
    tags: '[]',
  });
  return id;
}

async function insertAnalysis(captureId: string, fields: Record<string, unknown> = {}): Promise<string> {
  const id = newId();
  await db('analyses').insert({ id, capture_id: captureId, settings: '{}', status: 'queued', ...fields });
  return id;
}

async function statusOf(id: string) {
  return db('analyses').where({ id }).first('status', 'error', 'claimed_by', 'attempts', 'progress', 'stage', 'intrinsic_linewidth_hz', 'heartbeat_at');
}

async function waitFor<T>(what: string, probe: () => Promise<T | undefined | false>, timeoutMs = 20_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

const settled = (ids: string[]) => async () => {
  const rows = await db('analyses').whereIn('id', ids).whereIn('status', ['done', 'failed']).count({ n: '*' });
  return Number(rows[0].n) === ids.length;
};

beforeAll(async () => {
  db = testDb();
  benchId = newId();
  await db('benches').insert({ id: benchId, name: 'Runner bench' });
});

beforeEach(async () => {
  // Other files' leftovers must not be claimed here: this file owns the queue while it runs.
  await db('analyses').whereIn('status', ['queued', 'running']).update({ status: 'failed', error: 'cleared by jobs-runner.test' });
});

afterAll(async () => {
  await db('benches').where({ id: benchId }).delete();
  await closeTestDb();
});

describe('JobRunner.start()', () => {
  it('re-queues rows left running with a stale heartbeat by a dead process, then runs them', async () => {
    const captureId = await insertCapture();
    const stale = await insertAnalysis(captureId, {
      status: 'running',
      claimed_by: 'dead-host:1:gone',
      attempts: 1,
      heartbeat_at: db.raw('NOW(3) - INTERVAL 10 MINUTE'),
      started_at: db.raw('NOW(3) - INTERVAL 11 MINUTE'),
    });
    const executor = recordingExecutor();
    const runner = new JobRunner({ db, storage, executor, staleAfterMs: 30_000, pollIntervalMs: 50 });
    await runner.start();
    try {
      await waitFor('the stale job to finish', settled([stale]));
    } finally {
      await runner.stop();
    }
    const row = await statusOf(stale);
    expect(row.status).toBe('done');
    expect(row.claimed_by).toBe(runner.id);
    expect(row.attempts).toBe(2);
    expect(row.intrinsic_linewidth_hz).toBe(1);
    expect(executor.runs.get(stale)).toBe(1);
  });

  it('leaves alone a running row whose heartbeat is fresh (another live runner holds it)', async () => {
    const captureId = await insertCapture();
    const held = await insertAnalysis(captureId, {
      status: 'running',
      claimed_by: 'live-host:2:busy',
      attempts: 1,
      heartbeat_at: db.raw('NOW(3)'),
    });
    const queued = await insertAnalysis(captureId);
    const executor = recordingExecutor();
    const runner = new JobRunner({ db, storage, executor, staleAfterMs: 60_000, pollIntervalMs: 50 });
    await runner.start();
    try {
      await waitFor('the queued job', settled([queued]));
    } finally {
      await runner.stop();
    }
    const row = await statusOf(held);
    expect(row.status).toBe('running');
    expect(row.claimed_by).toBe('live-host:2:busy');
    expect(executor.runs.has(held)).toBe(false);
  });

  it('fails instead of re-queuing a stale row that has already been tried maxAttempts times', async () => {
    const captureId = await insertCapture();
    const doomed = await insertAnalysis(captureId, {
      status: 'running',
      claimed_by: 'dead-host:3:gone',
      attempts: 3,
      heartbeat_at: db.raw('NOW(3) - INTERVAL 1 HOUR'),
    });
    const executor = recordingExecutor();
    const runner = new JobRunner({ db, storage, executor, maxAttempts: 3, pollIntervalMs: 50 });
    await runner.start();
    await runner.stop();
    const row = await statusOf(doomed);
    expect(row.status).toBe('failed');
    expect(row.error).toMatch(/started 3 times/);
    expect(executor.runs.has(doomed)).toBe(false);
  });
});

describe('two runners on one database', () => {
  it('run each of 20 queued jobs exactly once', async () => {
    const captureId = await insertCapture();
    const ids: string[] = [];
    for (let i = 0; i < 20; i++) ids.push(await insertAnalysis(captureId));
    const runs = new Map<string, number>();
    // each runner has its own connection pool, as two server processes would
    const otherDb = createDb(loadEnv());
    const delay = () => 5 + Math.floor(Math.random() * 25);
    const a = new JobRunner({ db, storage, executor: recordingExecutor({ size: 3, runs, delayMs: delay }), runnerId: 'runner-a', pollIntervalMs: 20 });
    const b = new JobRunner({ db: otherDb, storage, executor: recordingExecutor({ size: 3, runs, delayMs: delay }), runnerId: 'runner-b', pollIntervalMs: 20 });
    try {
      await Promise.all([a.start(), b.start()]);
      await waitFor('all 20 jobs', settled(ids));
    } finally {
      await Promise.all([a.stop(), b.stop()]);
      await otherDb.destroy();
    }
    expect([...runs.keys()].sort()).toEqual([...ids].sort());
    expect([...runs.values()].every((n) => n === 1)).toBe(true);
    const rows = await db('analyses').whereIn('id', ids).select('status', 'claimed_by', 'attempts');
    expect(rows.every((r) => r.status === 'done' && r.attempts === 1)).toBe(true);
    // both took part (claims interleave; with 20 jobs of 5–30 ms one runner alone would be a fluke)
    const byRunner = new Set(rows.map((r) => r.claimed_by));
    expect(byRunner).toEqual(new Set(['runner-a', 'runner-b']));
  });
});

describe('a worker thread that fails', () => {
  let dir: string;
  let workerFile: string;

  beforeAll(() => {
    // A stand-in worker: settings.segment picks how it behaves.
    dir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-worker-'));
    workerFile = path.join(dir, 'misbehaving-worker.mjs');
    writeFileSync(
      workerFile,
      `export default async function ({ task, port }) {
  const mode = task.settings.segment;
  port.postMessage({ fraction: 0.5, stage: 'reading' });
  if (mode === 101) throw new Error('the numbers went wrong');
  if (mode === 102) process.exit(7);
  if (mode === 103) return { ok: false, message: 'NaN or Inf value in frame 12 (byte offset 96)' };
  if (mode === 104) { setTimeout(() => { throw new Error('late failure'); }, 0); await new Promise(() => {}); }
  return {
    ok: true,
    result: { fromWorker: true },
    figures: { intrinsicLinewidthHz: 42, betaLinewidthHz: null, lineshapeFwhmHz: null, whiteFloorHz2PerHz: null },
    displaySeries: { frequencyHz: [], frequencyNoiseHz2PerHz: [] },
    seriesKey: null,
  };
}
`,
    );
  });

  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('marks its job failed with the reason, and the runner and this process go on', async () => {
    const captureId = await insertCapture();
    const thrown = await insertAnalysis(captureId, { settings: JSON.stringify({ segment: 101 }) });
    const exited = await insertAnalysis(captureId, { settings: JSON.stringify({ segment: 102 }) });
    const refused = await insertAnalysis(captureId, { settings: JSON.stringify({ segment: 103 }) });
    const uncaught = await insertAnalysis(captureId, { settings: JSON.stringify({ segment: 104 }) });
    const fine = await insertAnalysis(captureId, { settings: JSON.stringify({ segment: 4096 }) });
    const ids = [thrown, exited, refused, uncaught, fine];
    const executor = createWorkerPool({ size: 1, filename: workerFile });
    const runner = new JobRunner({ db, storage, executor, pollIntervalMs: 20 });
    try {
      await runner.start();
      await waitFor('all five jobs', settled(ids), 60_000);
    } finally {
      await runner.stop();
      await executor.close();
    }
    expect((await statusOf(thrown)).error).toBe('analysis worker crashed: the numbers went wrong');
    expect((await statusOf(exited)).error).toMatch(/^analysis worker crashed: .*exited with code.*7/);
    expect((await statusOf(refused)).error).toBe('NaN or Inf value in frame 12 (byte offset 96)');
    expect((await statusOf(uncaught)).error).toBe('analysis worker crashed: late failure');
    for (const id of [thrown, exited, refused, uncaught]) expect((await statusOf(id)).status).toBe('failed');
    const ok = await statusOf(fine);
    expect(ok.status).toBe('done');
    expect(ok.intrinsic_linewidth_hz).toBe(42);
  });
});

describe('progress, heartbeat and stop', () => {
  it('writes a burst of progress updates once, then the latest after the interval', async () => {
    const captureId = await insertCapture();
    const id = await insertAnalysis(captureId);
    const progressWrites: unknown[][] = [];
    const onQuery = (q: { sql: string; bindings?: unknown[] }) => {
      if (/^update `analyses` set `progress`/.test(q.sql)) progressWrites.push(q.bindings ?? []);
    };
    db.on('query', onQuery);
    const executor: AnalysisExecutor = {
      size: 1,
      async run(task, onProgress: (u: ProgressUpdate) => void) {
        for (let i = 1; i <= 50; i++) onProgress({ fraction: i / 100, stage: i < 50 ? 'reading' : 'spectrum' });
        await new Promise((r) => setTimeout(r, 900));
        return okOutcome(task);
      },
      async close() {},
    };
    const runner = new JobRunner({ db, storage, executor, progressIntervalMs: 500, pollIntervalMs: 20 });
    try {
      await runner.start();
      await waitFor('the job', settled([id]));
    } finally {
      await runner.stop();
      db.off('query', onQuery);
    }
    expect(progressWrites.length).toBe(2);
    expect(progressWrites[0]).toContain(0.01);
    expect(progressWrites[0]).toContain('reading');
    expect(progressWrites[1]).toContain(0.5);
    expect(progressWrites[1]).toContain('spectrum');
    expect((await statusOf(id)).progress).toBe(1);
  });

  it('keeps the heartbeat of a long job fresh, and stop() puts the job back in the queue', async () => {
    const captureId = await insertCapture();
    const id = await insertAnalysis(captureId);
    let started!: () => void;
    const running = new Promise<void>((r) => (started = r));
    const executor: AnalysisExecutor = {
      size: 1,
      run(_task, _onProgress, signal) {
        started();
        return new Promise((_resolve, reject) => signal?.addEventListener('abort', () => reject(new Error('aborted'))));
      },
      async close() {},
    };
    const runner = new JobRunner({ db, storage, executor, heartbeatIntervalMs: 50, pollIntervalMs: 20 });
    await runner.start();
    await running;
    const first = (await statusOf(id)).heartbeat_at as Date;
    await waitFor('a newer heartbeat', async () => {
      const now = (await statusOf(id)).heartbeat_at as Date;
      return now.getTime() > first.getTime();
    });
    await runner.stop();
    const row = await statusOf(id);
    expect(row.status).toBe('queued');
    expect(row.claimed_by).toBeNull();
    expect(row.attempts).toBe(0);
  });
});
