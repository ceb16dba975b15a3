import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { phaseDiffusionLinewidthHz } from '../../analysis/laser/estimator';
import {
  DEFAULT_RATE_EQUATION_PARAMETERS,
  modalGainRate,
  rateEquationSteadyState,
  recombinationRate,
  resolveRateEquationParameters,
  spontaneousRate,
} from '../../analysis/laser/rate-equation-model';
import { createRateEquationSimulator, type RateEquationSimulatorOptions } from '../../analysis/laser/rate-equations';
import { analyzeCapture } from '../../analysis/pipeline';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

/** Simulates `samples` IQ samples and runs them through the ordinary capture analysis (raw float64 I,Q). */
async function simulateAndAnalyse(options: RateEquationSimulatorOptions, samples: number) {
  const sim = createRateEquationSimulator(options);
  const { channels } = sim.next(samples);
  const interleaved = new Float64Array(2 * samples);
  for (let i = 0; i < samples; i++) {
    interleaved[2 * i] = channels[0][i];
    interleaved[2 * i + 1] = channels[1][i];
  }
  const bytes = new Uint8Array(interleaved.buffer);
  const analysis = await analyzeCapture(
    { chunks: [bytes], totalBytes: bytes.length },
    { format: 'raw', dtype: 'float64', channels: 2, kind: 'iq', sampleRateHz: sim.sampleRateHz },
  );
  return { sim, analysis };
}

describe('rateEquationSteadyState (METHODS 6.4 model, textbook-order defaults from memory)', () => {
  const p = resolveRateEquationParameters();
  const s = rateEquationSteadyState(p);

  it('satisfies both balance equations to 1e-9 of the pump and of the photon decay', () => {
    const G = modalGainRate(p, s.carriers, s.photons);
    expect(Math.abs(p.pumpRatePerS - recombinationRate(p, s.carriers) - G * s.photons) / p.pumpRatePerS).toBeLessThan(1e-9);
    expect(Math.abs((G - p.photonDecayRatePerS) * s.photons + spontaneousRate(p, s.carriers)) / (p.photonDecayRatePerS * s.photons)).toBeLessThan(1e-9);
  });

  it('derived constants by hand: α_m = ln(1/0.32)/250 µm = 45.58 /cm, v_g = c/4.2, 1/τ_p = v_g(α_i + α_m)', () => {
    expect(p.mirrorLossPerCm).toBeCloseTo(Math.log(1 / 0.32) / 0.025, 10);
    expect(p.groupVelocityCmPerS).toBeCloseTo(29979245800 / 4.2, 0);
    expect(p.photonDecayRatePerS).toBeCloseTo(p.groupVelocityCmPerS * (5 + p.mirrorLossPerCm), 0);
  });

  it('above threshold the photon number follows the slope η_i(I − I_th)/q·τ_p within 5 % (spontaneous emission and compression aside)', () => {
    const expected = ((p.injectionEfficiency * (p.currentMa - s.thresholdCurrentMa) * 1e-3) / 1.602176634e-19) / p.photonDecayRatePerS;
    expect(rel(s.photons, expected)).toBeLessThan(0.05);
    expect(s.thresholdCurrentMa).toBeGreaterThan(1);
    expect(s.thresholdCurrentMa).toBeLessThan(p.currentMa);
  });

  it('predictedLinewidthHz = R_sp(1 + α²)/(4πP) at the steady state (estimator.ts)', () => {
    expect(s.predictedLinewidthHz).toBe(phaseDiffusionLinewidthHz(s.spontaneousRatePerS, s.photons, p.alphaFactor));
  });

  it('rejects unknown or bad parameters, naming them', () => {
    expect(() => resolveRateEquationParameters({ currentMa: -1 })).toThrow(/currentMa/);
    expect(() => resolveRateEquationParameters({ bogus: 1 } as never)).toThrow(/unknown rate-equation parameter 'bogus'/);
    expect(() => resolveRateEquationParameters({ facetReflectivities: [0.3, 1] })).toThrow(/facetReflectivities/);
    expect(() => resolveRateEquationParameters({ gainShiftDensityCm3: -2e18 })).toThrow(/N_tr \+ N_s/);
  });
});

describe('createRateEquationSimulator: the analysed record agrees with the prediction (METHODS 6.4)', () => {
  // 2^16 samples at 10 GHz (6.6 µs); steps of 2 ps keep the run short — over seeds and steps of 1–4 ps the
  // analysed floor stayed within 4 % of the prediction, so 20 % is a wide margin for a model check.
  const samples = 1 << 16;
  const common = { seed: 2, maxStepS: 2e-12 };

  it('intrinsic linewidth from the ordinary pipeline (Welch + white floor) within 20 % of R_sp(1+α²)/(4πP); doubling β_sp raises it', async () => {
    const base = await simulateAndAnalyse(common, samples);
    const predicted = base.sim.steadyState.predictedLinewidthHz;
    expect(rel(base.analysis.report.intrinsicLinewidthHz, predicted)).toBeLessThan(0.2);

    const doubled = await simulateAndAnalyse({ ...common, seed: 3, spontaneousCoupling: 2 * DEFAULT_RATE_EQUATION_PARAMETERS.spontaneousCoupling }, samples);
    const predicted2 = doubled.sim.steadyState.predictedLinewidthHz;
    expect(rel(doubled.analysis.report.intrinsicLinewidthHz, predicted2)).toBeLessThan(0.2);
    // R_sp doubles while P hardly moves: the prediction nearly doubles, and so does what the pipeline reads
    expect(predicted2 / predicted).toBeGreaterThan(1.9);
    expect(doubled.analysis.report.intrinsicLinewidthHz).toBeGreaterThan(1.5 * base.analysis.report.intrinsicLinewidthHz);
  });

  it('the same seed and options give the same samples whatever the block sizes', () => {
    const a = createRateEquationSimulator({ ...common, warmupS: 1e-10 });
    const b = createRateEquationSimulator({ ...common, warmupS: 1e-10 });
    const whole = a.next(300).channels[0];
    const parts = [b.next(100).channels[0], b.next(50).channels[0], b.next(150).channels[0]];
    const joined = new Float64Array(300);
    joined.set(parts[0], 0);
    joined.set(parts[1], 100);
    joined.set(parts[2], 150);
    expect(Array.from(joined)).toEqual(Array.from(whole));
    expect(b.samplesOut).toBe(300);
  });

  it('without noise the laser sits at its steady state: |E|² = P_out', () => {
    const sim = createRateEquationSimulator({ noise: false, warmupS: 0 });
    const { channels } = sim.next(64);
    const power = channels[0][63] ** 2 + channels[1][63] ** 2;
    expect(rel(power, sim.steadyState.outputPowerMw)).toBeLessThan(1e-6);
  });

  it('the step divides the sample period: 10 GHz with steps ≤ 3 ps → 34 steps of 2.94 ps', () => {
    const sim = createRateEquationSimulator({ maxStepS: 3e-12, warmupS: 0 });
    expect(sim.stepsPerSample).toBe(34);
    expect(sim.stepS * sim.stepsPerSample).toBeCloseTo(1e-10, 20);
  });

  it('rejects a laser below threshold and bad options', () => {
    expect(() => createRateEquationSimulator({ currentMa: 1 })).toThrow(/below threshold/);
    expect(() => createRateEquationSimulator({ sampleRateHz: 0 })).toThrow(/sampleRateHz/);
    expect(() => createRateEquationSimulator({ maxStepS: 1e-9 })).toThrow(/maxStepS/);
    expect(() => createRateEquationSimulator({ seed: -1 })).toThrow(/seed/);
    expect(() => createRateEquationSimulator().next(-1)).toThrow(AnalysisInputError);
  });
});
