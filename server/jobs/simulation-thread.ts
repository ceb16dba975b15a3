/**
 * Runs simulations in worker threads (simulation-worker.ts) through a small piscina pool of its own: one
 * thread, started on demand and ended when idle, so a server that never simulates holds none. Progress
 * arrives on a MessagePort handed to each task; a worker that throws or exits rejects only its own run.
 * TypeScript workers get `--import tsx`, as the analysis pool's do.
 */
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { AnalysisInputError } from '../../analysis/errors';
import type { SimulationOutcome, SimulationTask } from './simulation-task';

export const SIMULATION_WORKER_FILE = path.join(import.meta.dirname, 'simulation-worker.ts');

let pool: Piscina | undefined;

function simulationPool(): Piscina {
  pool ??= new Piscina({
    filename: SIMULATION_WORKER_FILE,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 30_000,
    execArgv: ['--import', 'tsx'],
    resourceLimits: { maxOldGenerationSizeMb: 512 },
  });
  pool.on('error', () => {});
  return pool;
}

export async function runSimulationThread(task: SimulationTask, onProgress: (fraction: number) => void): Promise<Uint8Array> {
  const { port1, port2 } = new MessageChannel();
  port1.on('message', (fraction: number) => onProgress(fraction));
  try {
    let outcome: SimulationOutcome;
    try {
      outcome = (await simulationPool().run({ task, port: port2 }, { transferList: [port2] })) as SimulationOutcome;
    } catch (e) {
      throw new Error(`simulation worker crashed: ${(e as Error).message}`, { cause: e });
    }
    if (!(outcome instanceof Uint8Array)) throw new AnalysisInputError(outcome.message);
    return outcome;
  } finally {
    port1.close();
  }
}

/** Ends the pool's thread (shutdown, tests). */
export async function closeSimulationPool(): Promise<void> {
  const p = pool;
  pool = undefined;
  await p?.destroy();
}
