/**
 * Analyses: read one (status, progress, result), its spectrum in a view, its full series as CSV;
 * queue a new analysis of a capture with other settings (kept beside the earlier ones); retry a
 * failed one; a laser's analysed captures over time. Running them is the job runner's work.
 */
import { Readable } from 'node:stream';
import type { Knex } from 'knex';
import type {
  Analysis,
  AnalysisSettings,
  LaserSpectraResponse,
  SpectrumResponse,
  SpectrumView,
} from '../../contracts/analyses';
import { AppError, conflict } from '../../errors';
import { newId } from '../../lib/ids';
import type { Storage } from '../../storage/storage';
import { recordAudit } from '../audit/record-audit';
import type { BenchAccess } from '../benches/bench-policy';
import {
  accessFromRow,
  ANALYSIS_NOT_FOUND,
  assertCaptureAction,
  assertIdShape,
  CAPTURE_NOT_FOUND,
} from '../captures/capture-policy';
import { findCaptureForUser } from '../captures/captures.repository';
import type { LasersService } from '../lasers/lasers.service';
import { toAnalysis } from './analysis-mapping';
import {
  findAnalysisForUser,
  findAnalysisSummary,
  insertAnalysis,
  listLaserSpectra,
  requeueFailed,
  SUMMARY_COLUMNS,
} from './analyses.repository';
import { LruMap, SeriesCache } from './series-cache';
import { spectrumResponse } from './spectrum-view';

export interface AnalysesServiceDeps {
  db: Knex;
  storage: Storage;
  lasers: LasersService;
  onQueued?: () => void;
}

function notDone(status: string): AppError {
  return conflict(
    status === 'failed'
      ? 'this analysis failed, so it has no spectrum; retry it or start a new one'
      : `this analysis is ${status}; its spectrum is there once it is done`,
  );
}

export function createAnalysesService(deps: AnalysesServiceDeps) {
  const { db, storage } = deps;
  const cache = new SeriesCache(storage);
  const replies = new LruMap<string, string>(512);

  async function load<C extends (typeof SUMMARY_COLUMNS)[number] | 'result' | 'series_key'>(
    userId: string,
    analysisId: string,
    columns: readonly C[],
  ) {
    assertIdShape(analysisId, ANALYSIS_NOT_FOUND);
    const row = await findAnalysisForUser(db, analysisId, userId, columns);
    const access = accessFromRow(row, userId, ANALYSIS_NOT_FOUND);
    return { row: row!, access };
  }

  async function seriesKeyOf(userId: string, analysisId: string) {
    const { row, access } = await load(userId, analysisId, ['status', 'series_key'] as const);
    assertCaptureAction(access, 'captures.read');
    if (row.status !== 'done') throw notDone(row.status);
    if (!row.series_key) throw conflict('this analysis kept no series; start a new analysis of the capture');
    return { key: row.series_key };
  }

  // A plot asks for the same spectrum many times in a row (views, points, several viewers): a granted
  // read is remembered for GRANT_TTL_MS, so a removed member keeps reading a spectrum for at most that long.
  const GRANT_TTL_MS = 2000;
  const grants = new Map<string, { key: string; until: number }>();
  async function recentSeriesKeyOf(userId: string, analysisId: string) {
    const id = `${userId}|${analysisId}`;
    const now = Date.now();
    const hit = grants.get(id);
    if (hit && hit.until > now) return { key: hit.key };
    const { key } = await seriesKeyOf(userId, analysisId);
    if (grants.size > 10_000) grants.clear();
    grants.set(id, { key, until: now + GRANT_TTL_MS });
    return { key };
  }

  async function seriesOf(userId: string, analysisId: string) {
    const { key } = await seriesKeyOf(userId, analysisId);
    return { key, series: await cache.get(key) };
  }

  async function summaryAfterWrite(analysisId: string, benchId: string): Promise<Analysis> {
    const row = await findAnalysisSummary(db, analysisId);
    if (!row) throw new Error('the analysis vanished right after it was written');
    return toAnalysis({ ...row, result: null }, benchId);
  }

  return {
    async get(userId: string, analysisId: string): Promise<Analysis> {
      const { row, access } = await load(userId, analysisId, [...SUMMARY_COLUMNS, 'result'] as const);
      assertCaptureAction(access, 'captures.read');
      return toAnalysis(row, access.benchId);
    },

    /**
     * The spectrum reply as JSON text. A done analysis never changes, so replies are kept by series,
     * view and points (the membership check still runs on every request).
     */
    async spectrumJson(userId: string, analysisId: string, query: { view: SpectrumView; points: number }): Promise<string> {
      const { key } = await recentSeriesKeyOf(userId, analysisId);
      const replyKey = `${key}|${query.view}|${query.points}`;
      let json = replies.get(replyKey);
      if (json === undefined) {
        const reply: SpectrumResponse = spectrumResponse(await cache.get(key), query.view, query.points);
        json = JSON.stringify(reply);
        replies.set(replyKey, json);
      }
      return json;
    },

    /** The full series as CSV text, streamed in slices. */
    async seriesCsv(userId: string, analysisId: string): Promise<Readable> {
      const { series } = await seriesOf(userId, analysisId);
      const { frequencyHz, psd } = series;
      function* lines(): Generator<string> {
        yield 'frequency_hz,s_nu_hz2_per_hz\n';
        const step = 4096;
        for (let start = 0; start < frequencyHz.length; start += step) {
          let text = '';
          const end = Math.min(frequencyHz.length, start + step);
          for (let i = start; i < end; i++) text += `${frequencyHz[i]},${psd[i]}\n`;
          yield text;
        }
      }
      return Readable.from(lines());
    },

    /** A new analysis of the capture with these settings, queued beside the earlier ones. */
    async create(userId: string, captureId: string, parseSettings: () => AnalysisSettings): Promise<Analysis> {
      assertIdShape(captureId, CAPTURE_NOT_FOUND);
      const capture = await findCaptureForUser(db, captureId, userId);
      const access = accessFromRow(capture, userId, CAPTURE_NOT_FOUND);
      assertCaptureAction(access, 'captures.write');
      // the role is checked before the body: a refused member learns nothing about validation
      const settings = parseSettings();
      const id = newId();
      await db.transaction(async (trx) => {
        await insertAnalysis(trx, { id, capture_id: captureId, created_by: userId, settings, created_at: new Date() });
        await recordAudit(trx, { benchId: access.benchId, actorId: userId, action: 'analysis.created', targetType: 'analysis', targetId: id, details: { captureId } });
      });
      deps.onQueued?.();
      return summaryAfterWrite(id, access.benchId);
    },

    /** A failed analysis back to the queue with its settings (409 unless it failed). */
    async retry(userId: string, analysisId: string): Promise<Analysis> {
      const { row, access } = await load(userId, analysisId, ['status'] as const);
      assertCaptureAction(access, 'captures.write');
      if (row.status !== 'failed' || !(await requeueFailed(db, analysisId))) {
        throw conflict(`only a failed analysis can be retried; this one is ${row.status}`);
      }
      await recordAudit(db, { benchId: access.benchId, actorId: userId, action: 'analysis.retried', targetType: 'analysis', targetId: analysisId });
      deps.onQueued?.();
      return summaryAfterWrite(analysisId, access.benchId);
    },

    async laserSpectra(access: BenchAccess, laserId: string): Promise<LaserSpectraResponse> {
      assertCaptureAction(access, 'captures.read');
      const laser = await deps.lasers.get(access, laserId);
      const rows = await listLaserSpectra(db, access.benchId, laserId);
      return {
        laser,
        points: rows.map((r) => ({
          captureId: r.capture_id,
          analysisId: r.analysis_id,
          fileName: r.file_name,
          createdAt: new Date(r.created_at).toISOString(),
          intrinsicLinewidthHz: r.intrinsic_linewidth_hz,
          betaLinewidthHz: r.beta_linewidth_hz,
          lineshapeFwhmHz: r.lineshape_fwhm_hz,
          driveCurrentMa: r.drive_current_ma,
          temperatureC: r.temperature_c,
          outputPowerMw: r.output_power_mw,
        })),
      };
    },
  };
}

export type AnalysesService = ReturnType<typeof createAnalysesService>;
