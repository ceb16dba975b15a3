/**
 * Stochastic single-mode rate equations (carriers, photons, phase) with Langevin forces, integrated in
 * small steps and sampled as an IQ record E = √P_out·e^{iφ}, block by block (bounded memory).
 *
 * Usage:
 *   import { createRateEquationSimulator } from '../analysis/laser/rate-equations';
 *   const sim = createRateEquationSimulator({ currentMa: 10, sampleRateHz: 10e9, seed: 1 });
 *   const block = sim.next(65536);           // SampleBlock: channels [I, Q], √mW
 *   sim.steadyState.predictedLinewidthHz;     // R_sp(1+α²)/(4πP), for comparison with the analysed record
 *
 * Model: analysis/laser/rate-equation-model.ts (Phaseloom METHODS 6.4; parameters after Coldren, Corzine &
 * Mašanović, 2nd ed. (2012), from memory). Langevin forces, in carrier number N and photon number P, with
 * R_sp the spontaneous rate into the mode (METHODS 6.4 correlations, from memory):
 *   ⟨F_P F_P⟩ = 2 R_sp P δ,  ⟨F_φ F_φ⟩ = R_sp/(2P) δ,  ⟨F_N F_N⟩ = 2(R_sp P + N/τ_e) δ,
 *   ⟨F_P F_N⟩ = −2 R_sp P δ,  F_φ independent.  N/τ_e = V(An + Bn² + Cn³) (all recombination).
 *   Realised per step Δt from independent unit normals ξ₁, ξ₂, ξ₃:
 *   ΔW_P = √(2R_sp P Δt) ξ₁,  ΔW_N = −ΔW_P + √(2(N/τ_e) Δt) ξ₂,  ΔW_φ = √(R_sp Δt/(2P)) ξ₃.
 *   The drift's own spontaneous term R_sp is the same β_sp B n² V, so drift and diffusion agree and the
 *   phase diffuses at R_sp(1+α²)/(2P) rad²/s: a Lorentzian of FWHM R_sp(1+α²)/(4πP) (METHODS 6.4).
 * Integrator: Itô, stochastic Heun for the drift (predictor x* = x + a(x)Δt + b(x)ΔW, corrector
 *   x + ½(a(x) + a(x*))Δt + b(x)ΔW with the diffusion at the start of the step) — weak order 1 like
 *   Euler–Maruyama, with second-order accuracy in the deterministic part (relaxation oscillations).
 *   P and N are kept positive (a floor of 1e-9 of their steady values; never reached in practice).
 * Defaults: output rate 10 GHz; step Δt ≤ 1 ps (rounded so an integer number of steps fills a sample);
 *   warm-up 5 ns discarded after starting at the deterministic steady state; seed 1; noise on.
 * Random numbers: xoshiro128** + Marsaglia polar (analysis/synth/), three independent streams; the same
 *   seed and options give the same samples whatever the block sizes.
 * Output: I = √P_out cos φ, Q = √P_out sin φ, P_out = hν v_g α_m P in mW (both facets) — the phase is the
 *   laser's optical phase relative to the cold-cavity frequency (a constant offset −(α/2)R_sp/P remains).
 * Worked check (tests/analysis/laser-rate-equations.test.ts): the record analysed by the ordinary pipeline
 *   gives the intrinsic linewidth within 20 % of R_sp(1+α²)/(4πP); doubling β_sp raises it.
 */

import { AnalysisInputError } from '../errors';
import { createGaussian } from '../synth/gaussian';
import { createRandom } from '../synth/prng';
import type { SampleBlock } from '../types';
import {
  type RateEquationParameters,
  type RateEquationSteadyState,
  type ResolvedRateEquationParameters,
  rateEquationSteadyState,
  resolveRateEquationParameters,
} from './rate-equation-model';

export interface RateEquationSimulatorOptions extends Partial<RateEquationParameters> {
  /** IQ sample rate, Hz (default 10 GHz) */
  sampleRateHz?: number;
  /** largest integration step, s (default 1e-12) */
  maxStepS?: number;
  /** simulated time discarded before the first sample, s (default 5e-9) */
  warmupS?: number;
  seed?: number;
  /** Langevin forces on (default true); off gives the deterministic laser (a pure tone) */
  noise?: boolean;
}

export interface RateEquationSimulator {
  readonly parameters: ResolvedRateEquationParameters;
  readonly steadyState: RateEquationSteadyState;
  readonly sampleRateHz: number;
  /** integration step actually used, s */
  readonly stepS: number;
  readonly stepsPerSample: number;
  readonly samplesOut: number;
  /** The next `count` samples (new arrays): channels [I, Q] in √mW. */
  next(count: number): SampleBlock;
}

export const MAX_RATE_EQUATION_BLOCK = 2 ** 22;
const CHUNK = 4096;

export function createRateEquationSimulator(options: RateEquationSimulatorOptions = {}): RateEquationSimulator {
  if (options === null || typeof options !== 'object') throw new AnalysisInputError('simulator options must be an object');
  const { sampleRateHz = 10e9, maxStepS = 1e-12, warmupS = 5e-9, seed = 1, noise = true, ...model } = options;
  if (!(typeof sampleRateHz === 'number' && Number.isFinite(sampleRateHz) && sampleRateHz > 0)) {
    throw new AnalysisInputError(`sampleRateHz must be a positive number, got ${String(sampleRateHz)}`);
  }
  if (!(typeof maxStepS === 'number' && maxStepS > 0 && maxStepS <= 1e-10)) {
    throw new AnalysisInputError(`maxStepS must lie in (0, 1e-10] s (the photon lifetime is ~ps), got ${String(maxStepS)}`);
  }
  if (!(typeof warmupS === 'number' && Number.isFinite(warmupS) && warmupS >= 0 && warmupS <= 1e-6)) {
    throw new AnalysisInputError(`warmupS must lie in [0, 1e-6] s, got ${String(warmupS)}`);
  }
  if (!Number.isInteger(seed) || seed < 0 || seed > 2 ** 44) throw new AnalysisInputError(`seed must be an integer in [0, 2^44], got ${String(seed)}`);
  if (typeof noise !== 'boolean') throw new AnalysisInputError(`noise must be true or false, got ${String(noise)}`);
  const p = resolveRateEquationParameters(model);
  const steady = rateEquationSteadyState(p);
  if (steady.photons < 100) {
    throw new AnalysisInputError(
      `the laser is below threshold at ${p.currentMa} mA (threshold ≈ ${steady.thresholdCurrentMa.toFixed(2)} mA): the phase-diffusion model needs a lasing mode`,
    );
  }
  const samplePeriod = 1 / sampleRateHz;
  const stepsPerSample = Math.max(1, Math.ceil(samplePeriod / maxStepS - 1e-9));
  if (stepsPerSample > 1e6) throw new AnalysisInputError(`sampleRateHz ${sampleRateHz} is too low for steps of ${maxStepS} s (over 1e6 steps per sample)`);
  const dt = samplePeriod / stepsPerSample;

  // constants of the drift
  const V = p.activeVolumeCm3;
  const invV = 1 / V;
  const gammaVg = p.confinementFactor * p.groupVelocityCmPerS;
  const g0 = p.gainCoefficientPerCm;
  const ns = p.gainShiftDensityCm3;
  const invTrShift = 1 / (p.transparencyDensityCm3 + ns);
  const compression = (p.gainCompressionCm3 * p.confinementFactor) / V; // ε S = ε Γ P / V
  const A = p.defectRecombinationPerS;
  const B = p.radiativeRecombinationCm3PerS;
  const C = p.augerRecombinationCm6PerS;
  const beta = p.spontaneousCoupling;
  const decay = p.photonDecayRatePerS;
  const pump = p.pumpRatePerS;
  const halfAlpha = p.alphaFactor / 2;
  const nFloor = 1e-9 * steady.carriers;
  const pFloor = 1e-9 * steady.photons;

  const streams = [1, 2, 3].map((k) => createGaussian(createRandom(seed * 256 + 32 + k)));
  const xi1 = new Float64Array(CHUNK);
  const xi2 = new Float64Array(CHUNK);
  const xi3 = new Float64Array(CHUNK);
  let used = CHUNK;

  const noiseOn = noise ? 1 : 0;
  let N = steady.carriers;
  let P = steady.photons;
  let phi = 0;
  let samplesOut = 0;

  function refill(): void {
    if (noise) {
      streams[0].fill(xi1, 1);
      streams[1].fill(xi2, 1);
      streams[2].fill(xi3, 1);
    }
    used = 0;
  }

  /**
   * `steps` steps of Δt (stochastic Heun for the drift, Itô diffusion at the start of the step); after every
   * `every` steps, `sample(j)` is called (j = 0, 1, …). The state lives in locals inside the loop.
   */
  function advance(steps: number, every: number, sample: ((j: number, P: number, phi: number) => void) | null): void {
    let n0 = N;
    let p0 = P;
    let ph = phi;
    let k = used;
    let j = 0;
    let count = 0;
    for (let s = 0; s < steps; s++) {
      if (k === CHUNK) {
        refill();
        k = 0;
      }
      // drift at x
      const n = n0 * invV;
      const gainRate = (gammaVg * g0 * Math.log((n + ns) * invTrShift)) / (1 + compression * p0); // G = Γ v_g g(n, S)
      const recomb = V * n * (A + n * (B + n * C)); // V(An + Bn² + Cn³)
      const rsp = beta * B * n * n * V; // R_sp = β_sp B n² V
      const netGain = gainRate - decay; // G − 1/τ_p
      const aN = pump - recomb - gainRate * p0;
      const aP = netGain * p0 + rsp;
      const aPhi = halfAlpha * netGain;
      // Langevin increments: ΔW_P = √(2R_sp P Δt)ξ₁, ΔW_N = −ΔW_P + √(2(N/τ_e)Δt)ξ₂, ΔW_φ = √(R_sp Δt/(2P))ξ₃
      const dWP = noiseOn * Math.sqrt(2 * rsp * p0 * dt) * xi1[k];
      const dWN = -dWP + noiseOn * Math.sqrt(2 * recomb * dt) * xi2[k];
      const dWPhi = noiseOn * Math.sqrt((rsp * dt) / (2 * p0)) * xi3[k];
      k++;
      // predictor x* = x + a(x)Δt + b(x)ΔW
      let nS = n0 + aN * dt + dWN;
      let pS = p0 + aP * dt + dWP;
      if (nS < nFloor) nS = nFloor;
      if (pS < pFloor) pS = pFloor;
      // drift at x*
      const n2 = nS * invV;
      const gain2 = (gammaVg * g0 * Math.log((n2 + ns) * invTrShift)) / (1 + compression * pS);
      const recomb2 = V * n2 * (A + n2 * (B + n2 * C));
      const rsp2 = beta * B * n2 * n2 * V;
      const net2 = gain2 - decay;
      // corrector: x + ½(a(x) + a(x*))Δt + b(x)ΔW
      n0 += 0.5 * (aN + pump - recomb2 - gain2 * pS) * dt + dWN;
      p0 += 0.5 * (aP + net2 * pS + rsp2) * dt + dWP;
      ph += 0.5 * (aPhi + halfAlpha * net2) * dt + dWPhi;
      if (n0 < nFloor) n0 = nFloor;
      if (p0 < pFloor) p0 = pFloor;
      if (sample !== null && ++count === every) {
        count = 0;
        if (ph > Math.PI || ph < -Math.PI) ph -= 2 * Math.PI * Math.round(ph / (2 * Math.PI)); // only cos/sin are used
        sample(j++, p0, ph);
      }
    }
    N = n0;
    P = p0;
    phi = ph;
    used = k;
  }

  advance(Math.round(warmupS / dt), 1, null);
  phi = 0;

  const outScale = p.outputMwPerPhoton;
  return {
    parameters: p,
    steadyState: steady,
    sampleRateHz,
    stepS: dt,
    stepsPerSample,
    get samplesOut() {
      return samplesOut;
    },
    next(count) {
      if (!Number.isInteger(count) || count < 0 || count > MAX_RATE_EQUATION_BLOCK) {
        throw new AnalysisInputError(`block size must be an integer in [0, ${MAX_RATE_EQUATION_BLOCK}], got ${String(count)}`);
      }
      const I = new Float64Array(count);
      const Q = new Float64Array(count);
      advance(count * stepsPerSample, stepsPerSample, (k, photons, phase) => {
        const amp = Math.sqrt(photons * outScale); // E = √P_out e^{iφ}
        I[k] = amp * Math.cos(phase);
        Q[k] = amp * Math.sin(phase);
      });
      samplesOut += count;
      return { channels: [I, Q] };
    },
  };
}
