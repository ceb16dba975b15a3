/**
 * Runs one simulation in its own worker thread (simulation-worker.ts) and resolves with the .npy bytes.
 * Progress arrives on the thread's messages; a thread that throws or exits early rejects only this run.
 * TypeScript workers get `--import tsx`, as the analysis pool's do.
 */
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { AnalysisInputError } from '../../analysis/errors';
import type { SimulationMessage, SimulationTask } from './simulation-task';

export const SIMULATION_WORKER_FILE = path.join(import.meta.dirname, 'simulation-worker.ts');

export function runSimulationThread(task: SimulationTask, onProgress: (fraction: number) => void): Promise<Uint8Array> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(SIMULATION_WORKER_FILE, {
      workerData: task,
      execArgv: ['--import', 'tsx'],
      resourceLimits: { maxOldGenerationSizeMb: 512 },
    });
    let settled = false;
    const settle = (fn: () => void) => {
      if (settled) return;
      settled = true;
      fn();
    };
    worker.on('message', (m: SimulationMessage) => {
      if (m.type === 'progress') onProgress(m.fraction);
      else if (m.type === 'done') settle(() => resolve(m.npy));
      else settle(() => reject(new AnalysisInputError(m.message)));
    });
    worker.on('error', (e) => settle(() => reject(new Error(`simulation worker crashed: ${e.message}`))));
    worker.on('exit', (code) => settle(() => reject(new Error(`simulation worker exited (${code}) before it finished`))));
  });
}
