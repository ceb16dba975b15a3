/**
 * The job runner: claims queued analyses from the database (job-queue.ts), runs each in the worker
 * pool, writes progress and stage back at most every `progressIntervalMs`, keeps a heartbeat on the
 * rows it holds, and records the outcome. On start — and then every `staleAfterMs` — it sends rows
 * left 'running' with a stale heartbeat (their process died) back to the queue. A task that throws,
 * or whose worker exits, fails only its own job ('analysis worker crashed: …'); an engine input error
 * fails it with the engine's message verbatim. Any number of runners may share one database.
 */
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { Storage } from '../storage/storage';
import type { AnalysisExecutor, AnalysisTask, ProgressUpdate } from './analysis-task';
import {
  beat,
  claimNextJob,
  completeJob,
  failJob,
  recoverStaleJobs,
  releaseJobs,
  writeProgress,
  type ClaimedJob,
} from './job-queue';

export interface RunnerLogger {
  info(obj: object, msg: string): void;
  warn(obj: object, msg: string): void;
  error(obj: object, msg: string): void;
}

export interface JobRunnerOptions {
  db: Knex;
  storage: Storage;
  executor: AnalysisExecutor;
  /** unique per runner; default host:pid:random */
  runnerId?: string;
  /** jobs run at once; default the executor's size */
  concurrency?: number;
  /** how long to wait for work when the queue is empty (a `poke()` ends the wait early) */
  pollIntervalMs?: number;
  heartbeatIntervalMs?: number;
  /** a 'running' row whose heartbeat is older than this belongs to a dead process */
  staleAfterMs?: number;
  progressIntervalMs?: number;
  /** a job whose process died this many times is failed instead of re-queued */
  maxAttempts?: number;
  /** points of the display series kept in the row */
  displayPoints?: number;
  logger?: RunnerLogger;
  /** told after an analysis was recorded as done or failed (e-mail notices); must not throw */
  onFinished?: (analysisId: string) => void;
}

const silent: RunnerLogger = { info() {}, warn() {}, error() {} };

interface RunningJob {
  abort: AbortController;
  done: Promise<void>;
}

export class JobRunner {
  readonly id: string;
  private readonly db: Knex;
  private readonly storage: Storage;
  private readonly executor: AnalysisExecutor;
  private readonly concurrency: number;
  private readonly pollIntervalMs: number;
  private readonly heartbeatIntervalMs: number;
  private readonly staleAfterMs: number;
  private readonly progressIntervalMs: number;
  private readonly maxAttempts: number;
  private readonly displayPoints: number;
  private readonly log: RunnerLogger;
  private readonly onFinished?: (analysisId: string) => void;

  private readonly jobs = new Map<string, RunningJob>();
  private stopped = true;
  private poked = false;
  private wake: (() => void) | null = null;
  private loop: Promise<void> | null = null;
  private timers: NodeJS.Timeout[] = [];

  constructor(options: JobRunnerOptions) {
    this.db = options.db;
    this.storage = options.storage;
    this.executor = options.executor;
    this.id = options.runnerId ?? `${hostname()}:${process.pid}:${randomBytes(4).toString('hex')}`.slice(0, 64);
    this.concurrency = Math.max(1, options.concurrency ?? options.executor.size);
    this.pollIntervalMs = options.pollIntervalMs ?? 1000;
    this.heartbeatIntervalMs = options.heartbeatIntervalMs ?? 2000;
    this.staleAfterMs = options.staleAfterMs ?? 30_000;
    this.progressIntervalMs = options.progressIntervalMs ?? 500;
    this.maxAttempts = options.maxAttempts ?? 3;
    this.displayPoints = options.displayPoints ?? 1000;
    this.log = options.logger ?? silent;
    this.onFinished = options.onFinished;
  }

  /** Jobs this runner is running now. */
  get activeJobs(): string[] {
    return [...this.jobs.keys()];
  }

  async start(): Promise<void> {
    if (!this.stopped) return;
    await this.recoverStale();
    this.stopped = false;
    this.timers = [
      setInterval(() => void this.heartbeat(), this.heartbeatIntervalMs),
      setInterval(() => void this.recoverStale(), this.staleAfterMs),
    ];
    for (const t of this.timers) t.unref();
    this.loop = this.claimLoop();
  }

  /** New work was queued: look now instead of at the next poll. */
  poke(): void {
    this.poked = true;
    this.wake?.();
  }

  /** Stops claiming, ends the running tasks and puts their rows back in the queue for another runner. */
  async stop(): Promise<void> {
    if (this.stopped) return;
    this.stopped = true;
    for (const t of this.timers) clearInterval(t);
    this.timers = [];
    this.poke();
    await this.loop;
    const held = [...this.jobs.entries()];
    for (const [, job] of held) job.abort.abort();
    await Promise.allSettled(held.map(([, job]) => job.done));
    try {
      await releaseJobs(
        this.db,
        this.id,
        held.map(([id]) => id),
      );
    } catch (e) {
      this.log.error({ err: e, runner: this.id }, 'could not release running analyses; they return to the queue when their heartbeat goes stale');
    }
  }

  private async claimLoop(): Promise<void> {
    while (!this.stopped) {
      if (this.jobs.size >= this.concurrency) {
        await this.sleep(this.pollIntervalMs);
        continue;
      }
      let job: ClaimedJob | null = null;
      try {
        job = await claimNextJob(this.db, this.id);
      } catch (e) {
        this.log.error({ err: e, runner: this.id }, 'claiming an analysis failed');
      }
      if (!job) {
        await this.sleep(this.pollIntervalMs);
        continue;
      }
      if (this.stopped) {
        await releaseJobs(this.db, this.id, [job.analysisId]).catch(() => {});
        break;
      }
      this.launch(job);
    }
  }

  private sleep(ms: number): Promise<void> {
    if (this.poked || this.stopped) {
      this.poked = false;
      return Promise.resolve();
    }
    return new Promise((resolve) => {
      const finish = () => {
        clearTimeout(timer);
        this.wake = null;
        this.poked = false;
        resolve();
      };
      const timer = setTimeout(finish, ms);
      this.wake = finish;
    });
  }

  private launch(job: ClaimedJob): void {
    const abort = new AbortController();
    const done = this.execute(job, abort.signal)
      .catch((e: unknown) => this.log.error({ err: e, analysisId: job.analysisId }, 'recording an analysis outcome failed'))
      .finally(() => {
        this.jobs.delete(job.analysisId);
        this.poke();
      });
    this.jobs.set(job.analysisId, { abort, done });
  }

  private async execute(job: ClaimedJob, signal: AbortSignal): Promise<void> {
    const seriesKey = `series/${job.analysisId}/${randomBytes(6).toString('hex')}.f64`;
    const task: AnalysisTask = {
      analysisId: job.analysisId,
      storage: this.storage.config,
      captureKey: job.captureKey,
      seriesKey,
      input: job.input,
      settings: job.settings,
      displayPoints: this.displayPoints,
    };
    const progress = this.progressWriter(job.analysisId);
    this.log.info({ analysisId: job.analysisId, runner: this.id, attempt: job.attempts }, 'analysis started');
    try {
      const outcome = await this.executor.run(task, progress.update, signal);
      progress.finish();
      if (outcome.ok) {
        const kept = await completeJob(this.db, job.analysisId, this.id, outcome);
        if (!kept && outcome.seriesKey) await this.storage.delete(outcome.seriesKey);
        this.log.info({ analysisId: job.analysisId, kept }, 'analysis done');
        if (kept) this.onFinished?.(job.analysisId);
      } else {
        await failJob(this.db, job.analysisId, this.id, outcome.message);
        this.log.info({ analysisId: job.analysisId, reason: outcome.message }, 'analysis refused its input');
        this.onFinished?.(job.analysisId);
      }
    } catch (e) {
      progress.finish();
      await this.storage.delete(seriesKey).catch(() => {});
      if (signal.aborted) return; // the runner is stopping; stop() puts the row back in the queue
      const message = `analysis worker crashed: ${e instanceof Error ? e.message : String(e)}`;
      this.log.warn({ err: e, analysisId: job.analysisId }, 'analysis worker crashed');
      await failJob(this.db, job.analysisId, this.id, message);
      this.onFinished?.(job.analysisId);
    }
  }

  /** Keeps the latest progress and writes it at most once per progressIntervalMs. */
  private progressWriter(analysisId: string) {
    let latest: ProgressUpdate | null = null;
    let lastWrite = 0;
    let timer: NodeJS.Timeout | null = null;
    let finished = false;
    const flush = () => {
      timer = null;
      if (finished || !latest) return;
      const { fraction, stage } = latest;
      latest = null;
      lastWrite = Date.now();
      writeProgress(this.db, analysisId, this.id, Math.min(1, Math.max(0, fraction)), stage).catch((e: unknown) =>
        this.log.warn({ err: e, analysisId }, 'writing analysis progress failed'),
      );
    };
    return {
      update: (u: ProgressUpdate) => {
        if (finished) return;
        latest = u;
        if (timer) return;
        const wait = lastWrite + this.progressIntervalMs - Date.now();
        if (wait <= 0) flush();
        else timer = setTimeout(flush, wait);
      },
      finish: () => {
        finished = true;
        if (timer) clearTimeout(timer);
      },
    };
  }

  private async heartbeat(): Promise<void> {
    try {
      await beat(this.db, this.id, this.activeJobs);
    } catch (e) {
      this.log.warn({ err: e, runner: this.id }, 'analysis heartbeat failed');
    }
  }

  private async recoverStale(): Promise<void> {
    try {
      const { requeued, failed } = await recoverStaleJobs(this.db, this.staleAfterMs, this.maxAttempts);
      if (requeued || failed) {
        this.log.info({ requeued, failed, runner: this.id }, 'analyses left running by a stopped process recovered');
        if (requeued) this.poke();
      }
    } catch (e) {
      this.log.error({ err: e, runner: this.id }, 'recovering stale analyses failed');
    }
  }
}
