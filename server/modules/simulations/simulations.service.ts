/**
 * Rate-equation simulations: check the request and the laser's steady state at once (a laser below
 * threshold or bad parameters → 400, nothing stored), keep a 'queued' row, answer, then — off the request —
 * integrate the stochastic rate equations in a worker thread (server/jobs/simulation-thread.ts) and store
 * the record as an ordinary capture through the captures service (file + capture row + queued analysis in
 * one transaction), tagged "synthetic", so it is analysed like any upload and listed with the captures.
 * Runs go one at a time per process (each holds a core for its duration); while this process holds a
 * run its heartbeat is refreshed, and a run whose heartbeat is stale is reported failed when read.
 * The prediction beside each run: the model's steady state R_sp(1 + α²)/(4πP) (METHODS 6.4) and the
 * estimator's inputs for the same laser — n_sp = R_sp/(v_g g_th) = R_sp·τ_p (the spontaneous rate into the
 * mode written in the estimator's form R_sp = v_g g_th n_sp, analysis/laser/estimator.ts) and the power out
 * of facet 1, its share of P_out.
 */
import { Readable } from 'node:stream';
import type { Knex } from 'knex';
import { estimateLaserLinewidth } from '../../../analysis/laser/estimator';
import { rateEquationSteadyState, resolveRateEquationParameters } from '../../../analysis/laser/rate-equation-model';
import type { ParsedCaptureUploadFields } from '../../contracts/captures';
import type {
  ParsedCreateSimulationRequest,
  RateEquationParametersInput,
  Simulation,
  SimulationPrediction,
} from '../../contracts/simulations';
import { AppError, notFound } from '../../errors';
import { newId } from '../../lib/ids';
import { runSimulationThread } from '../../jobs/simulation-thread';
import type { SimulationTask } from '../../jobs/simulation-task';
import type { Storage } from '../../storage/storage';
import { parseJsonColumn } from '../analyses/analysis-mapping';
import { assertCan, type BenchAccess } from '../benches/bench-policy';
import { assertCaptureAction, assertIdShape } from '../captures/capture-policy';
import type { CapturesService } from '../captures/captures.service';
import { receiveIntoStorage } from '../captures/upload-storage-engine';
import type { LasersService } from '../lasers/lasers.service';
import {
  beatSimulations,
  failStaleSimulations,
  findSimulation,
  findSimulationForUser,
  insertSimulation,
  listSimulations,
  updateSimulation,
  type SimulationRowWithAnalysis,
} from './simulations.repository';

export const SIMULATION_NOT_FOUND = 'no such simulation, or it is not on a bench of yours';
export const SYNTHETIC_TAG = 'synthetic';
const HEARTBEAT_MS = 15_000;
const STALE_MS = 120_000;
const PROGRESS_WRITE_MS = 250;

export interface SimulationsServiceDeps {
  db: Knex;
  storage: Storage;
  captures: CapturesService;
  lasers: LasersService;
  logger?: { warn(obj: object, msg: string): void; error(obj: object, msg: string): void };
  /** injectable for tests; defaults to a worker thread per run */
  runThread?: typeof runSimulationThread;
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

function toSimulation(row: SimulationRowWithAnalysis): Simulation {
  return {
    id: row.id,
    benchId: row.bench_id,
    laserId: row.laser_id,
    name: row.name,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    parameters: parseJsonColumn<RateEquationParametersInput>(row.parameters) ?? {},
    durationS: row.duration_s,
    sampleRateHz: row.sample_rate_hz,
    seed: Number(row.seed),
    maxStepS: row.max_step_s,
    samples: row.samples,
    prediction: parseJsonColumn<SimulationPrediction>(row.prediction),
    captureId: row.capture_id,
    analysisId: row.analysis_id,
    analysis: row.a_status ? { status: row.a_status, progress: row.a_progress ?? 0, intrinsicLinewidthHz: row.a_intrinsic_linewidth_hz } : null,
    error: row.error,
    createdBy: row.created_by,
    createdAt: iso(row.created_at)!,
    finishedAt: iso(row.finished_at),
  };
}

/** The model's steady state and the estimator's inputs for the same laser (throws AnalysisInputError → 400). */
export function predictSimulation(parameters: RateEquationParametersInput): SimulationPrediction {
  const p = resolveRateEquationParameters(parameters);
  const s = rateEquationSteadyState(p);
  if (s.photons < 100) {
    throw new AppError(400, 'validation_failed', 'check this field: parameters.currentMa', [
      { path: 'parameters.currentMa', message: `the laser is below threshold at ${p.currentMa} mA (threshold ≈ ${s.thresholdCurrentMa.toPrecision(3)} mA)` },
    ]);
  }
  const equivalentNsp = s.spontaneousRatePerS * s.photonLifetimeS; // n_sp = R_sp/(v_g g_th) = R_sp·τ_p
  const base = {
    wavelengthNm: p.wavelengthNm,
    groupIndex: p.groupIndex,
    cavityLengthUm: p.cavityLengthUm,
    facetReflectivities: [p.facetReflectivities[0], p.facetReflectivities[1]] as [number, number],
    internalLossPerCm: p.internalLossPerCm,
    nsp: Math.max(1, equivalentNsp),
    alphaFactor: p.alphaFactor,
  };
  // share of P_out through facet 1 (the estimator takes the facet-1 power)
  const share = estimateLaserLinewidth({ ...base, outputPowerMw: 1 }).outputFacetShare;
  return {
    thresholdCurrentMa: s.thresholdCurrentMa,
    outputPowerMw: s.outputPowerMw,
    photons: s.photons,
    carrierDensityCm3: s.carrierDensityCm3,
    spontaneousRatePerS: s.spontaneousRatePerS,
    photonLifetimeS: s.photonLifetimeS,
    relaxationFrequencyHz: s.relaxationFrequencyHz,
    predictedLinewidthHz: s.predictedLinewidthHz,
    equivalentNsp,
    estimatorInput: { ...base, nsp: equivalentNsp, outputPowerMw: share * s.outputPowerMw },
  };
}

/** "rate-equation-laser-at-10-ma-seed-1-ckaec5.npy": readable in the captures list, distinct per run. */
export function syntheticFileName(name: string, seed: number, id: string): string {
  const slug = name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'simulation';
  return `${slug}-seed-${seed}-${id.slice(0, 6)}.npy`;
}

export function createSimulationsService(deps: SimulationsServiceDeps) {
  const { db } = deps;
  const runThread = deps.runThread ?? runSimulationThread;
  const held = new Set<string>();
  let chain: Promise<void> = Promise.resolve();
  let beater: NodeJS.Timeout | undefined;

  function startBeating(): void {
    if (beater) return;
    beater = setInterval(() => {
      if (held.size === 0) {
        clearInterval(beater);
        beater = undefined;
        return;
      }
      beatSimulations(db, [...held], new Date()).catch((err: unknown) => deps.logger?.warn({ err }, 'simulation heartbeat failed'));
    }, HEARTBEAT_MS);
    beater.unref();
  }

  async function run(id: string, access: BenchAccess, task: SimulationTask, fields: ParsedCaptureUploadFields, fileName: string): Promise<void> {
    await updateSimulation(db, id, { status: 'running', stage: 'simulating', heartbeat_at: new Date() });
    let lastWrite = 0;
    let writing: Promise<void> = Promise.resolve();
    const npy = await runThread(task, (fraction) => {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_MS) return;
      lastWrite = now;
      writing = writing
        .then(() => updateSimulation(db, id, { progress: Math.min(0.99, fraction), heartbeat_at: new Date() }))
        .catch(() => undefined);
    });
    await writing;
    await updateSimulation(db, id, { stage: 'storing', progress: 0.99, heartbeat_at: new Date() });
    const received = await receiveIntoStorage(deps.storage, Readable.from([Buffer.from(npy.buffer, npy.byteOffset, npy.byteLength)]), fileName);
    const stored = await deps.captures.create(access, received, fields);
    await updateSimulation(db, id, {
      status: 'done',
      stage: 'done',
      progress: 1,
      capture_id: stored.capture.id,
      analysis_id: stored.analysis.id,
      finished_at: new Date(),
    });
  }

  function enqueue(id: string, access: BenchAccess, task: SimulationTask, fields: ParsedCaptureUploadFields, fileName: string): void {
    held.add(id);
    startBeating();
    chain = chain.then(async () => {
      try {
        await run(id, access, task, fields, fileName);
      } catch (e) {
        const message = e instanceof Error ? e.message : String(e);
        if (!(e instanceof AppError)) deps.logger?.error({ err: e, simulationId: id }, 'simulation failed');
        await updateSimulation(db, id, { status: 'failed', stage: 'failed', error: message, finished_at: new Date() }).catch(() => undefined);
      } finally {
        held.delete(id);
      }
    });
  }

  async function checkLaser(access: BenchAccess, laserId: string | undefined): Promise<void> {
    if (!laserId) return;
    try {
      await deps.lasers.get(access, laserId);
    } catch (e) {
      if (e instanceof AppError && e.status === 404) {
        throw new AppError(400, 'validation_failed', 'check this field: laserId', [{ path: 'laserId', message: 'no such laser on this bench' }]);
      }
      throw e;
    }
  }

  return {
    async create(access: BenchAccess, input: ParsedCreateSimulationRequest): Promise<Simulation> {
      assertCaptureAction(access, 'captures.write');
      await checkLaser(access, input.laserId);
      const prediction = predictSimulation(input.parameters);
      const samples = Math.round(input.durationS * input.sampleRateHz);
      const id = newId();
      const now = new Date();
      const name = input.name ?? `Rate-equation laser at ${input.parameters.currentMa ?? 10} mA`;
      await insertSimulation(db, {
        id,
        bench_id: access.benchId,
        laser_id: input.laserId ?? null,
        created_by: access.userId,
        name,
        status: 'queued',
        progress: 0,
        stage: 'queued',
        parameters: input.parameters,
        duration_s: input.durationS,
        sample_rate_hz: input.sampleRateHz,
        seed: input.seed,
        max_step_s: input.maxStepS ?? null,
        samples,
        prediction,
        capture_id: null,
        analysis_id: null,
        error: null,
        heartbeat_at: now,
        finished_at: null,
        created_at: now,
      });
      const task: SimulationTask = {
        parameters: input.parameters,
        sampleRateHz: input.sampleRateHz,
        samples,
        seed: input.seed,
        ...(input.maxStepS !== undefined ? { maxStepS: input.maxStepS } : {}),
      };
      const fields: ParsedCaptureUploadFields = {
        kind: 'iq',
        format: 'npy',
        sampleRateHz: input.sampleRateHz,
        ...(input.laserId ? { laserId: input.laserId } : {}),
        driveCurrentMa: input.parameters.currentMa ?? 10,
        outputPowerMw: prediction.outputPowerMw,
        notes:
          `Synthetic IQ record from the rate-equation simulator (${name}; seed ${input.seed}; ${samples} samples at ${input.sampleRateHz / 1e9} GHz; ` +
          `predicted intrinsic linewidth ${(prediction.predictedLinewidthHz / 1e6).toPrecision(4)} MHz). Model defaults are textbook-order values from memory.`,
        tags: [SYNTHETIC_TAG],
      };
      // read before the run is queued, so the reply says 'queued' whatever the worker does next
      const row = await findSimulation(db, id);
      if (!row) throw new Error('the simulation vanished right after it was stored');
      enqueue(id, access, task, fields, syntheticFileName(name, input.seed, id));
      return toSimulation(row);
    },

    async get(userId: string, id: string): Promise<Simulation> {
      assertIdShape(id, SIMULATION_NOT_FOUND);
      let row = await findSimulationForUser(db, id, userId);
      if (!row || !row.role) throw notFound(SIMULATION_NOT_FOUND);
      if ((row.status === 'queued' || row.status === 'running') && !held.has(id)) {
        if (await failStaleSimulations(db, { id }, new Date(Date.now() - STALE_MS))) row = { ...(await findSimulation(db, id))!, role: row.role };
      }
      return toSimulation(row);
    },

    async list(access: BenchAccess): Promise<Simulation[]> {
      assertCan(access, 'bench.read');
      await failStaleSimulations(db, { benchId: access.benchId }, new Date(Date.now() - STALE_MS));
      return (await listSimulations(db, access.benchId)).map(toSimulation);
    },

    /** Resolves when every run queued so far has ended (tests, shutdown). */
    async idle(): Promise<void> {
      let seen: Promise<void>;
      do {
        seen = chain;
        await seen;
      } while (seen !== chain);
    },
  };
}

export type SimulationsService = ReturnType<typeof createSimulationsService>;
