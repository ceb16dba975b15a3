/**
 * The worker-thread pool (piscina) that runs analyses off the event loop. Size: PHASELOOM_WORKERS, or
 * one thread per core but one (at least 1). Progress travels back on a MessagePort handed to each
 * task. A worker that throws, exits or runs out of memory rejects only its own task; piscina starts a
 * new thread in its place, and the server keeps running.
 * Workers are TypeScript files: they get `--import tsx` so that they load the same .ts sources under
 * `node --import tsx server/index.ts` and under vitest.
 */
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { MessageChannel, type MessagePort } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { AnalysisExecutor, AnalysisOutcome, AnalysisTask, ProgressUpdate } from './analysis-task';

export const DEFAULT_WORKER_FILE = path.join(import.meta.dirname, 'analysis-worker.ts');

export interface WorkerPoolOptions {
  /** threads; default max(1, cores − 1) */
  size?: number;
  /** the worker module (default analysis-worker.ts); tests pass their own */
  filename?: string;
  /** heap cap of one worker, MB: an analysis that runs away ends its worker, not the server */
  maxOldGenerationSizeMb?: number;
}

export function defaultWorkerCount(configured?: number): number {
  if (configured !== undefined && configured > 0) return configured;
  return Math.max(1, availableParallelism() - 1);
}

/** The message a worker receives: the task plus the port its progress goes to. */
export interface WorkerMessage {
  task: AnalysisTask;
  port: MessagePort;
}

export function createWorkerPool(options: WorkerPoolOptions = {}): AnalysisExecutor {
  const size = defaultWorkerCount(options.size);
  const filename = options.filename ?? DEFAULT_WORKER_FILE;
  const pool = new Piscina({
    filename,
    // threads start with the pool and load the engine at once, so the first analysis does not wait
    minThreads: size,
    maxThreads: size,
    execArgv: /\.[cm]?ts$/.test(filename) ? ['--import', 'tsx'] : [],
    resourceLimits: { maxOldGenerationSizeMb: options.maxOldGenerationSizeMb ?? 2048 },
  });
  // A worker's 'error' also rejects the task it ran; this listener only keeps it from being unhandled.
  pool.on('error', () => {});

  return {
    size,
    async run(task, onProgress: (update: ProgressUpdate) => void, signal?: AbortSignal): Promise<AnalysisOutcome> {
      const { port1, port2 } = new MessageChannel();
      port1.on('message', (m: ProgressUpdate) => onProgress(m));
      try {
        return (await pool.run({ task, port: port2 }, { transferList: [port2], signal: signal ?? null })) as AnalysisOutcome;
      } finally {
        port1.close();
      }
    },
    async close() {
      await pool.destroy();
    },
  };
}
