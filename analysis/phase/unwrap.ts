/**
 * Phase unwrapping, streaming: the same result block by block as over the whole record.
 *
 * Usage:
 *   import { createPhaseUnwrapper, unwrapPhase } from '../analysis/phase/unwrap';
 *   const u = createPhaseUnwrapper();
 *   const out1 = u.push(block1); const out2 = u.push(block2);   // == unwrapPhase([...block1, ...block2])
 *
 * Rule (as numpy.unwrap with the default period 2π): each step d = p[k] − p[k−1] with |d| > π is
 * replaced by d − 2π·round(d/2π) mapped into [−π, π] (a step of exactly ±π is kept), and the
 * corrections accumulate. The last raw sample and the running correction are the carried state.
 * Steps whose wrapped size exceeds 0.8π are counted (METHODS 2.7: unwrapping may have failed there).
 * Units: rad in, rad out. Worked check (numpy.unwrap gives the same): [0, 3, 6.5, −3] → [0, 3, 0.21681…, 3.28318…].
 */

export const LARGE_STEP_RAD = 0.8 * Math.PI;

const TWO_PI = 2 * Math.PI;

/** A raw phase step d mapped into [−π, π] the way numpy.unwrap does (|d| ≤ π is left alone). */
export function wrapStep(d: number): number {
  if (d >= -Math.PI && d <= Math.PI) return d;
  // numpy: ddmod = mod(d + π, 2π) − π, with −π turned into +π when d > 0
  let m = ((d + Math.PI) % TWO_PI + TWO_PI) % TWO_PI - Math.PI;
  if (m === -Math.PI && d > 0) m = Math.PI;
  return m;
}

export interface PhaseUnwrapper {
  /** Unwrapped phase of the next block (a new array; the input is not modified). */
  push(phase: ArrayLike<number>): Float64Array;
  /** steps seen so far whose wrapped size exceeded 0.8π */
  readonly largeSteps: number;
  readonly samplesSeen: number;
}

export function createPhaseUnwrapper(): PhaseUnwrapper {
  let prevRaw = 0;
  let prevOut = 0;
  let started = false;
  let largeSteps = 0;
  let samplesSeen = 0;
  return {
    push(phase) {
      const n = phase.length;
      const out = new Float64Array(n);
      let k = 0;
      if (!started && n > 0) {
        prevRaw = phase[0];
        prevOut = phase[0];
        out[0] = prevOut;
        started = true;
        k = 1;
      }
      for (; k < n; k++) {
        const raw = phase[k];
        const step = wrapStep(raw - prevRaw);
        if (step > LARGE_STEP_RAD || step < -LARGE_STEP_RAD) largeSteps++;
        prevOut += step;
        prevRaw = raw;
        out[k] = prevOut;
      }
      samplesSeen += n;
      return out;
    },
    get largeSteps() {
      return largeSteps;
    },
    get samplesSeen() {
      return samplesSeen;
    },
  };
}

/** Unwrap a whole record. */
export function unwrapPhase(phase: ArrayLike<number>): Float64Array {
  return createPhaseUnwrapper().push(phase);
}
