/**
 * Worker thread of a rate-equation simulation: runs createRateEquationSimulator (analysis/laser/
 * rate-equations.ts) block by block, posts progress, and sends back a .npy float32 (N, 2) I/Q file whose
 * buffer is transferred (not copied). Never runs on the request thread.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { isAnalysisInputError } from '../../analysis/errors';
import { createRateEquationSimulator } from '../../analysis/laser/rate-equations';
import { npyFloat32Iq } from './simulation-npy';
import type { SimulationMessage, SimulationTask } from './simulation-task';

const BLOCK = 8192;

function post(message: SimulationMessage, transfer: ArrayBuffer[] = []): void {
  parentPort!.postMessage(message, transfer);
}

function run(task: SimulationTask): void {
  try {
    const sim = createRateEquationSimulator({
      ...task.parameters,
      sampleRateHz: task.sampleRateHz,
      seed: task.seed,
      ...(task.maxStepS !== undefined ? { maxStepS: task.maxStepS } : {}),
    });
    const { bytes, data } = npyFloat32Iq(task.samples);
    let lastPost = 0;
    for (let start = 0; start < task.samples; start += BLOCK) {
      const n = Math.min(BLOCK, task.samples - start);
      const [i, q] = sim.next(n).channels;
      for (let k = 0; k < n; k++) {
        data[2 * (start + k)] = i[k];
        data[2 * (start + k) + 1] = q[k];
      }
      const now = Date.now();
      if (now - lastPost > 200) {
        lastPost = now;
        post({ type: 'progress', fraction: (start + n) / task.samples });
      }
    }
    post({ type: 'done', npy: bytes }, [bytes.buffer as ArrayBuffer]);
  } catch (e) {
    if (isAnalysisInputError(e)) post({ type: 'failed', message: e.message });
    else throw e;
  }
}

run(workerData as SimulationTask);
