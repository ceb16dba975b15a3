/**
 * Link budgets: evaluate a coherent link's phase-noise budget (analysis/budget/link-budget.ts, Phaseloom
 * METHODS 7.1-7.3) from linewidths or from spectra on the caller's benches, with a table across symbol
 * rates; save budgets on a bench, list, read and delete them.
 * A laser given as `{ analysisId }` uses that analysis's full S_ν series (the file its job wrote), held at
 * its white floor above the measured band (the white floor is what a Lorentzian laser keeps to high
 * frequencies; without one, the last measured value). The analysis is read only through the caller's
 * membership of its bench: anyone else gets 404, as for an id that does not exist.
 */
import type { Knex } from 'knex';
import { type LaserNoise, type LinkBudgetInput, evaluateLinkBudget, linkBudgetTable } from '../../../analysis/budget/link-budget';
import type {
  EvaluateLinkBudgetRequest,
  LaserNoiseSource,
  LinkBudgetEvaluation,
  SavedLinkBudget,
} from '../../contracts/link-budgets';
import { AppError, forbidden, notFound } from '../../errors';
import { newId } from '../../lib/ids';
import type { Storage } from '../../storage/storage';
import { parseJsonColumn } from '../analyses/analysis-mapping';
import { findAnalysisForUser } from '../analyses/analyses.repository';
import { SeriesCache } from '../analyses/series-cache';
import { assertCan, type BenchAccess } from '../benches/bench-policy';
import { assertCaptureAction, assertIdShape } from '../captures/capture-policy';
import {
  deleteLinkBudget,
  findLinkBudget,
  findLinkBudgetForUser,
  insertLinkBudget,
  listLinkBudgets,
  type LinkBudgetRowWithName,
} from './link-budgets.repository';

export const LINK_BUDGET_NOT_FOUND = 'no such link budget, or it is not on a bench of yours';

/** Shown with every verdict, beside the engine's own caution. */
export const PRACTICE_CAUTION =
  'These figures do not replace the link design and sign-off of a qualified (licensed) engineer under your organisation’s practice.';

function fieldError(status: 400 | 404 | 409, path: string, message: string): AppError {
  const code = status === 400 ? 'validation_failed' : status === 404 ? 'not_found' : 'conflict';
  return new AppError(status, code, `check this field: ${path} — ${message}`, [{ path, message }]);
}

function toSaved(row: LinkBudgetRowWithName): SavedLinkBudget {
  return {
    id: row.id,
    benchId: row.bench_id,
    name: row.name,
    createdBy: row.created_by,
    createdByName: row.created_by_name ?? null,
    input: parseJsonColumn<EvaluateLinkBudgetRequest>(row.input)!,
    result: parseJsonColumn<LinkBudgetEvaluation>(row.result)!,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

/** JSON has no ∞: a budget without phase noise has an unbounded margin, reported as null. */
const finiteOrNull = (v: number | null): number | null => (v === null || !Number.isFinite(v) ? null : v);

export function createLinkBudgetsService(deps: { db: Knex; storage: Storage }) {
  const { db } = deps;
  const cache = new SeriesCache(deps.storage);

  /** The laser as the engine takes it; `benchId` (saving) requires the analysis to be on that bench. */
  async function laserNoise(userId: string, source: LaserNoiseSource, path: string, benchId?: string): Promise<LaserNoise> {
    if (source.analysisId === undefined) return { linewidthHz: source.linewidthHz as number };
    const field = `${path}.analysisId`;
    const missing = 'no such analysis, or it is not on a bench of yours';
    assertIdShape(source.analysisId, missing);
    const row = await findAnalysisForUser(db, source.analysisId, userId, ['status', 'series_key', 'white_floor_hz2_per_hz'] as const);
    if (!row || !row.role) throw fieldError(404, field, missing);
    if (benchId !== undefined && row.bench_id !== benchId) throw fieldError(400, field, 'this analysis is on another bench; a saved budget uses spectra of its own bench');
    if (row.status !== 'done') throw fieldError(409, field, `this analysis is ${row.status}; use it once it is done`);
    if (!row.series_key) throw fieldError(409, field, 'this analysis kept no series; start a new analysis of the capture');
    const series = await cache.get(row.series_key);
    const tail = row.white_floor_hz2_per_hz;
    return {
      spectrum: { frequencyHz: series.frequencyHz, psd: series.psd },
      ...(tail !== null && tail !== undefined && Number.isFinite(tail) && tail >= 0 ? { tailLevelHz2PerHz: tail } : {}),
    };
  }

  async function evaluate(userId: string, input: EvaluateLinkBudgetRequest, benchId?: string): Promise<LinkBudgetEvaluation> {
    const engineInput: LinkBudgetInput = { format: input.format, symbolRateBaud: input.symbolRateBaud };
    if (input.linewidthHz !== undefined) engineInput.linewidthHz = input.linewidthHz;
    if (input.transmitter) engineInput.transmitter = await laserNoise(userId, input.transmitter, 'transmitter', benchId);
    if (input.localOscillator) engineInput.localOscillator = await laserNoise(userId, input.localOscillator, 'localOscillator', benchId);
    if (input.carrierRecovery) engineInput.carrierRecovery = input.carrierRecovery;
    const r = evaluateLinkBudget(engineInput);
    const { symbolRateBaud: _rate, ...rest } = engineInput;
    void _rate;
    const rows = linkBudgetTable(rest, input.tableSymbolRatesBaud);
    return {
      format: r.format,
      symbolRateBaud: r.symbolRateBaud,
      combinedLinewidthHz: r.combinedLinewidthHz,
      linewidthBasis: r.linewidthBasis,
      linewidthSymbolProduct: r.linewidthSymbolProduct,
      toleranceProduct: r.toleranceProduct,
      toleranceSource: r.toleranceSource,
      toleranceCriterion: r.toleranceCriterion,
      marginFactor: finiteOrNull(r.marginFactor),
      marginDb: finiteOrNull(r.marginDb),
      pass: r.pass,
      verdict: r.verdict,
      caution: `${r.caution} ${PRACTICE_CAUTION}`,
      phaseIncrementVarianceRad2: r.phaseIncrementVarianceRad2,
      ...(r.residualPhaseErrorRad2 !== undefined ? { residualPhaseErrorRad2: r.residualPhaseErrorRad2 } : {}),
      ...(r.equivalentWienerLinewidthHz !== undefined ? { equivalentWienerLinewidthHz: r.equivalentWienerLinewidthHz } : {}),
      ...(r.carrierRecovery !== undefined ? { carrierRecovery: r.carrierRecovery } : {}),
      warnings: r.warnings,
      table: rows.map((t) => ({
        symbolRateBaud: t.symbolRateBaud,
        combinedLinewidthHz: t.combinedLinewidthHz,
        linewidthSymbolProduct: t.linewidthSymbolProduct,
        marginFactor: finiteOrNull(t.marginFactor),
        marginDb: finiteOrNull(t.marginDb),
        pass: t.pass,
        ...(t.residualPhaseErrorRad2 !== undefined ? { residualPhaseErrorRad2: t.residualPhaseErrorRad2 } : {}),
      })),
    };
  }

  async function accessToBudget(userId: string, id: string) {
    assertIdShape(id, LINK_BUDGET_NOT_FOUND);
    const row = await findLinkBudgetForUser(db, id, userId);
    if (!row || !row.role) throw notFound(LINK_BUDGET_NOT_FOUND);
    return { row, access: { benchId: row.bench_id, userId, role: row.role } as BenchAccess };
  }

  return {
    evaluate: (userId: string, input: EvaluateLinkBudgetRequest) => evaluate(userId, input),

    async save(access: BenchAccess, name: string, input: EvaluateLinkBudgetRequest): Promise<SavedLinkBudget> {
      assertCaptureAction(access, 'captures.write');
      // evaluated first: any error leaves nothing stored
      const result = await evaluate(access.userId, input, access.benchId);
      const id = newId();
      await insertLinkBudget(db, { id, bench_id: access.benchId, created_by: access.userId, name, input, result, created_at: new Date() });
      const row = await findLinkBudget(db, id);
      if (!row) throw new Error('the link budget vanished right after it was stored');
      return toSaved(row);
    },

    async list(access: BenchAccess): Promise<SavedLinkBudget[]> {
      assertCan(access, 'bench.read');
      return (await listLinkBudgets(db, access.benchId)).map(toSaved);
    },

    async get(userId: string, id: string): Promise<SavedLinkBudget> {
      const { row } = await accessToBudget(userId, id);
      return toSaved(row);
    },

    /** Owners delete any budget; analysts the budgets they saved. */
    async remove(userId: string, id: string): Promise<void> {
      const { row, access } = await accessToBudget(userId, id);
      const mine = access.role === 'analyst' && row.created_by === userId;
      if (access.role !== 'owner' && !mine) {
        throw forbidden(
          access.role === 'analyst'
            ? 'analysts delete only the link budgets they saved; ask an owner of the bench'
            : `your role on this bench (${access.role}) does not allow this; it needs owner, or the analyst who saved it`,
        );
      }
      await deleteLinkBudget(db, id);
    },
  };
}

export type LinkBudgetsService = ReturnType<typeof createLinkBudgetsService>;
