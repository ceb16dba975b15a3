/**
 * Worker-thread task of a rate-equation simulation (run by the piscina pool of simulation-thread.ts):
 * runs createRateEquationSimulator (analysis/laser/rate-equations.ts) block by block, posts progress on
 * the port it is handed, and returns a .npy float32 (N, 2) I/Q file whose buffer is moved, not copied.
 * Never runs on the request thread.
 */
import type { MessagePort } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { isAnalysisInputError } from '../../analysis/errors';
import { createRateEquationSimulator } from '../../analysis/laser/rate-equations';
import { npyFloat32Iq } from './simulation-npy';
import type { SimulationOutcome, SimulationTask } from './simulation-task';

const BLOCK = 8192;

export default function simulate({ task, port }: { task: SimulationTask; port: MessagePort }): SimulationOutcome {
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
        port.postMessage((start + n) / task.samples);
      }
    }
    return Piscina.move(bytes) as Uint8Array; // the file itself, its buffer moved
  } catch (e) {
    if (isAnalysisInputError(e)) return { message: e.message };
    throw e;
  } finally {
    port.close();
  }
}
