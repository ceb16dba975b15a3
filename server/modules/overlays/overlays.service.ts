/**
 * Overlays: several done spectra of one bench on one plot, saved with a name. Members read them;
 * owners and analysts create, rename, change the traces and delete. Analysis ids that are not done
 * analyses of the bench are refused with one message (400), so other benches' ids reveal nothing.
 */
import type { Knex } from 'knex';
import type { Overlay, OverlaySummary, OverlayTrace } from '../../contracts/overlays';
import { overlayColor } from '../../contracts/overlays';
import { AppError, notFound } from '../../errors';
import { newId } from '../../lib/ids';
import type { BenchAccess } from '../benches/bench-policy';
import { accessFromRow, assertCaptureAction, assertIdShape } from '../captures/capture-policy';
import {
  deleteOverlay,
  findOverlayForUser,
  insertOverlay,
  listOverlays,
  listTraceIds,
  updateOverlay,
  type OverlayRow,
} from './overlays.repository';
import { doneAnalysesOnBench, findTraceRows, iso, operatingPoint, traceFigures, traceSeries, traceSettings } from './trace-rows';

export const OVERLAY_NOT_FOUND = 'no such overlay, or it is not on a bench of yours';

type ParsedCreate = { name: string; analysisIds: string[] };
type ParsedUpdate = { name?: string; analysisIds?: string[] };

/** The traces of an overlay in order, with colours by position. */
export async function overlayTraces(db: Knex, analysisIds: readonly string[]): Promise<OverlayTrace[]> {
  const rows = new Map((await findTraceRows(db, analysisIds)).map((r) => [r.analysis_id, r]));
  return analysisIds.flatMap((id, position) => {
    const row = rows.get(id);
    if (!row) return [];
    return [
      {
        position,
        color: overlayColor(position),
        analysisId: row.analysis_id,
        captureId: row.capture_id,
        fileName: row.file_name,
        laserId: row.laser_id,
        laserName: row.laser_name,
        analysedAt: iso(row.finished_at),
        figures: traceFigures(row),
        settings: traceSettings(row),
        operatingPoint: operatingPoint(row),
        series: traceSeries(row),
      },
    ];
  });
}

function summaryOf(row: OverlayRow, traceCount: number): OverlaySummary {
  return {
    id: row.id,
    benchId: row.bench_id,
    name: row.name,
    traceCount,
    createdAt: iso(row.created_at) as string,
    updatedAt: iso(row.updated_at) as string,
  };
}

export function createOverlaysService(db: Knex) {
  async function assertAnalysesOnBench(benchId: string, ids: readonly string[]): Promise<void> {
    const found = await doneAnalysesOnBench(db, benchId, ids);
    const details = ids.flatMap((id, i) =>
      found.has(id) ? [] : [{ path: `analysisIds.${i}`, message: 'not a finished spectrum on this bench' }],
    );
    if (details.length > 0) throw new AppError(400, 'validation_failed', 'some spectra are not finished spectra on this bench', details);
  }

  async function load(userId: string, overlayId: string) {
    assertIdShape(overlayId, OVERLAY_NOT_FOUND);
    const row = await findOverlayForUser(db, overlayId, userId);
    const access = accessFromRow(row, userId, OVERLAY_NOT_FOUND);
    return { row: row!, access };
  }

  async function full(row: OverlayRow): Promise<Overlay> {
    const traces = await overlayTraces(db, await listTraceIds(db, row.id));
    return { ...summaryOf(row, traces.length), traces };
  }

  async function reread(overlayId: string, userId: string): Promise<Overlay> {
    const row = await findOverlayForUser(db, overlayId, userId);
    if (!row) throw notFound(OVERLAY_NOT_FOUND);
    return full(row);
  }

  return {
    async list(access: BenchAccess): Promise<OverlaySummary[]> {
      assertCaptureAction(access, 'captures.read');
      const rows = await listOverlays(db, access.benchId);
      return rows.map((r) => summaryOf(r, Number(r.trace_count)));
    },

    async create(access: BenchAccess, parse: () => ParsedCreate): Promise<Overlay> {
      assertCaptureAction(access, 'captures.write');
      const input = parse();
      await assertAnalysesOnBench(access.benchId, input.analysisIds);
      const id = newId();
      await insertOverlay(db, { id, bench_id: access.benchId, name: input.name, created_by: access.userId, created_at: new Date() }, input.analysisIds);
      return reread(id, access.userId);
    },

    async get(userId: string, overlayId: string): Promise<Overlay> {
      const { row, access } = await load(userId, overlayId);
      assertCaptureAction(access, 'captures.read');
      return full(row);
    },

    async update(userId: string, overlayId: string, parse: () => ParsedUpdate): Promise<Overlay> {
      const { access } = await load(userId, overlayId);
      assertCaptureAction(access, 'captures.write');
      const input = parse();
      if (input.analysisIds) await assertAnalysesOnBench(access.benchId, input.analysisIds);
      await updateOverlay(db, overlayId, input);
      return reread(overlayId, userId);
    },

    async remove(userId: string, overlayId: string): Promise<void> {
      const { access } = await load(userId, overlayId);
      assertCaptureAction(access, 'captures.write');
      await deleteOverlay(db, overlayId);
    },

    /** The caller's access to the overlay's bench (404 for non-members); for share links. */
    async accessTo(userId: string, overlayId: string): Promise<{ access: BenchAccess; name: string }> {
      const { row, access } = await load(userId, overlayId);
      return { access, name: row.name };
    },
  };
}

export type OverlaysService = ReturnType<typeof createOverlaysService>;
