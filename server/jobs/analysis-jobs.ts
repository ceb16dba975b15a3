/**
 * The analysis jobs of one server process: a worker-thread pool and the runner that feeds it from
 * the database queue. PHASELOOM_WORKERS sets the pool size (default cores − 1, at least 1);
 * PHASELOOM_WORKERS=0 runs no analyses in this process (a web-only process beside worker processes
 * that share the database and the storage).
 */
import type { Knex } from 'knex';
import type { Storage } from '../storage/storage';
import { JobRunner, type RunnerLogger } from './runner';
import { createWorkerPool } from './worker-pool';

export interface AnalysisJobs {
  /** new analyses were queued: claim now rather than at the next poll */
  poke(): void;
  start(): Promise<void>;
  /** stops claiming, puts running analyses back in the queue, ends the worker threads */
  stop(): Promise<void>;
  readonly runner: JobRunner | null;
}

export function createAnalysisJobs(options: {
  db: Knex;
  storage: Storage;
  /** PHASELOOM_WORKERS: undefined = cores − 1 (at least 1), 0 = none in this process */
  workers?: number;
  logger?: RunnerLogger;
  /** told when an analysis finished (done or failed) */
  onFinished?: (analysisId: string) => void;
}): AnalysisJobs {
  if (options.workers === 0) {
    return { poke() {}, async start() {}, async stop() {}, runner: null };
  }
  const executor = createWorkerPool({ size: options.workers });
  const runner = new JobRunner({ db: options.db, storage: options.storage, executor, logger: options.logger, onFinished: options.onFinished });
  return {
    runner,
    poke: () => runner.poke(),
    start: () => runner.start(),
    async stop() {
      await runner.stop();
      await executor.close();
    },
  };
}
