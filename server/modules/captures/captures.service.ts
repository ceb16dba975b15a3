/**
 * Captures: receive an upload (checked by the engine's quick look at its first bytes), store it with
 * its first analysis queued — the capture row and the analysis row in one transaction, the file moved
 * into place inside it, so that no file is left without its rows nor rows without their file — list,
 * read and delete (file and rows together).
 */
import { createReadStream } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import type { z } from 'zod';
import type { AnalysisSettings } from '../../contracts/analyses';
import {
  settingsFromUpload,
  type Capture,
  type CaptureDetailResponse,
  type CaptureListQuery,
  type CaptureListResponse,
  type CreateCaptureResponse,
  type ParsedCaptureUploadFields,
  type SetupParams,
} from '../../contracts/captures';
import { AppError } from '../../errors';
import { newId } from '../../lib/ids';
import type { Storage } from '../../storage/storage';
import { parseJsonColumn, toAnalysisSummary } from '../analyses/analysis-mapping';
import { findAnalysisSummary, insertAnalysis, listAnalysesOfCapture } from '../analyses/analyses.repository';
import { recordAudit } from '../audit/record-audit';
import type { BenchAccess } from '../benches/bench-policy';
import type { LasersService } from '../lasers/lasers.service';
import {
  accessFromRow,
  assertCaptureAction,
  assertIdShape,
  assertMayDeleteCapture,
  CAPTURE_NOT_FOUND,
} from './capture-policy';
import {
  deleteCapture,
  findCaptureByFileName,
  findCaptureForUser,
  findCaptureWithNames,
  findFirstWithSha256,
  insertCapture,
  listCaptures,
  storageKeysOfCapture,
  type CaptureRow,
  type CaptureRowWithNames,
} from './captures.repository';
import { inspectUpload } from './inspect-upload';
import { receiveIntoStorage, type ReceivedFile } from './upload-storage-engine';

type ParsedListQuery = z.output<typeof CaptureListQuery>;

export interface CapturesServiceDeps {
  db: Knex;
  storage: Storage;
  lasers: LasersService;
  /** called after new analyses were queued (the job runner looks at once instead of at its next poll) */
  onQueued?: () => void;
  logger?: { warn(obj: object, msg: string): void };
}

export function toCapture(row: CaptureRowWithNames): Capture {
  return {
    id: row.id,
    benchId: row.bench_id,
    laserId: row.laser_id,
    uploadedBy: row.uploaded_by,
    uploadedByName: row.uploaded_by_name ?? null,
    fileName: row.file_name,
    sizeBytes: Number(row.size_bytes),
    sha256: row.sha256,
    format: row.format,
    kind: row.kind,
    sampleRateHz: row.sample_rate_hz,
    dtype: row.dtype,
    channels: row.channels,
    byteOrder: row.byte_order,
    setup: row.setup,
    setupParams: parseJsonColumn<SetupParams>(row.setup_params),
    driveCurrentMa: row.drive_current_ma,
    temperatureC: row.temperature_c,
    outputPowerMw: row.output_power_mw,
    notes: row.notes,
    tags: parseJsonColumn<string[]>(row.tags) ?? [],
    duplicateOf: row.duplicate_of,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

/** A file name as shown: the last path segment, control characters dropped, at most 255 characters. */
function cleanFileName(name: string): string {
  // eslint-disable-next-line no-control-regex
  const base = path.basename(name.replace(/\\/g, '/')).replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return (base || 'capture').slice(0, 255);
}

export function createCapturesService(deps: CapturesServiceDeps) {
  const { db, storage } = deps;

  async function accessToCapture(userId: string, captureId: string) {
    assertIdShape(captureId, CAPTURE_NOT_FOUND);
    const row = await findCaptureForUser(db, captureId, userId);
    return { row: row as CaptureRowWithNames, access: accessFromRow(row, userId, CAPTURE_NOT_FOUND) };
  }

  async function checkLaser(access: BenchAccess, laserId: string | undefined): Promise<void> {
    if (!laserId) return;
    try {
      await deps.lasers.get(access, laserId);
    } catch (e) {
      if (e instanceof AppError && e.status === 404) {
        throw new AppError(400, 'validation_failed', 'check this field: laserId', [
          { path: 'laserId', message: 'no such laser on this bench' },
        ]);
      }
      throw e;
    }
  }

  /**
   * Stores a received file as a capture with its first analysis queued. The temporary file is moved
   * into place or removed: whatever fails, nothing is left half-stored.
   */
  async function create(
    access: BenchAccess,
    file: ReceivedFile,
    fields: ParsedCaptureUploadFields,
  ): Promise<CreateCaptureResponse> {
    const captureId = newId();
    const analysisId = newId();
    const finalKey = `captures/${access.benchId}/${captureId}`;
    let moved = false;
    try {
      assertCaptureAction(access, 'captures.write');
      const settings: AnalysisSettings = settingsFromUpload(fields);
      const inspected = inspectUpload(file.head, file.sizeBytes, file.originalName, fields);
      await checkLaser(access, fields.laserId);
      const duplicateOf = await findFirstWithSha256(db, access.benchId, file.sha256);
      const now = new Date();
      const row: CaptureRow = {
        id: captureId,
        bench_id: access.benchId,
        laser_id: fields.laserId ?? null,
        uploaded_by: access.userId,
        file_name: cleanFileName(file.originalName),
        storage_key: finalKey,
        size_bytes: file.sizeBytes,
        sha256: file.sha256,
        format: inspected.format,
        kind: inspected.kind,
        sample_rate_hz: inspected.sampleRateHz,
        dtype: inspected.dtype,
        channels: inspected.channels,
        byte_order: inspected.byteOrder,
        setup: fields.setup ?? null,
        setup_params: fields.setupParams ?? null,
        drive_current_ma: fields.driveCurrentMa ?? null,
        temperature_c: fields.temperatureC ?? null,
        output_power_mw: fields.outputPowerMw ?? null,
        notes: fields.notes ?? null,
        tags: fields.tags ?? [],
        duplicate_of: duplicateOf,
        created_at: now,
      };
      await db.transaction(async (trx) => {
        await insertCapture(trx, row);
        await insertAnalysis(trx, {
          id: analysisId,
          capture_id: captureId,
          created_by: access.userId,
          settings,
          created_at: now,
        });
        await recordAudit(trx, {
          benchId: access.benchId,
          actorId: access.userId,
          action: 'capture.uploaded',
          targetType: 'capture',
          targetId: captureId,
          details: { fileName: row.file_name, sha256: row.sha256, sizeBytes: row.size_bytes, analysisId },
        });
        // Inside the transaction: a failed move rolls the rows back.
        await storage.move(file.tempKey, finalKey);
        moved = true;
      });
    } catch (e) {
      // Whatever failed — the check, a row, the move or the commit — no file is left behind.
      await storage.delete(file.tempKey).catch(() => {});
      if (moved) await storage.delete(finalKey).catch(() => {});
      throw e;
    }
    deps.onQueued?.();
    const captureRow = await findCaptureWithNames(db, captureId);
    const analysisRow = await findAnalysisSummary(db, analysisId);
    if (!captureRow || !analysisRow) throw new Error('the capture vanished right after it was stored');
    const capture = toCapture(captureRow);
    const reply: CreateCaptureResponse = { capture, analysis: toAnalysisSummary(analysisRow) };
    if (capture.duplicateOf) reply.duplicateOf = capture.duplicateOf;
    return reply;
  }

  return {
    create,

    /**
     * The same path for a file already on this machine (the demo seed, scripts): streamed into
     * storage with its sha256, then `create`.
     */
    async createFromPath(
      access: BenchAccess,
      filePath: string,
      fields: ParsedCaptureUploadFields,
      fileName = path.basename(filePath),
    ): Promise<CreateCaptureResponse> {
      assertCaptureAction(access, 'captures.write');
      const received = await receiveIntoStorage(storage, createReadStream(filePath), fileName);
      return create(access, received, fields);
    },

    /** The earliest capture on the bench with this file name, or null (the demo seed stays idempotent with it). */
    async findByFileName(access: BenchAccess, fileName: string): Promise<Capture | null> {
      assertCaptureAction(access, 'captures.read');
      const row = await findCaptureByFileName(db, access.benchId, fileName);
      return row ? toCapture(row) : null;
    },

    async list(access: BenchAccess, query: ParsedListQuery): Promise<CaptureListResponse> {
      assertCaptureAction(access, 'captures.read');
      const { rows, total } = await listCaptures(
        db,
        { benchId: access.benchId, laserId: query.laserId, kind: query.kind, tag: query.tag },
        { limit: query.pageSize, offset: (query.page - 1) * query.pageSize },
      );
      return {
        captures: rows.map((r) => ({
          ...toCapture(r),
          latestAnalysis: r.a_id
            ? {
                id: r.a_id,
                status: r.a_status!,
                progress: r.a_progress ?? 0,
                stage: r.a_stage ?? '',
                intrinsicLinewidthHz: r.a_intrinsic_linewidth_hz,
                betaLinewidthHz: r.a_beta_linewidth_hz,
                lineshapeFwhmHz: r.a_lineshape_fwhm_hz,
              }
            : null,
        })),
        page: query.page,
        pageSize: query.pageSize,
        total,
      };
    },

    async get(userId: string, captureId: string): Promise<CaptureDetailResponse> {
      const { row, access } = await accessToCapture(userId, captureId);
      assertCaptureAction(access, 'captures.read');
      const analyses = await listAnalysesOfCapture(db, captureId);
      return { capture: toCapture(row), analyses: analyses.map(toAnalysisSummary) };
    },

    /** Deletes the capture's rows (its analyses go with it), then its file and series files. */
    async remove(userId: string, captureId: string): Promise<void> {
      const { row, access } = await accessToCapture(userId, captureId);
      assertMayDeleteCapture(access, row.uploaded_by);
      let keys: string[] = [];
      await db.transaction(async (trx) => {
        keys = [row.storage_key, ...(await storageKeysOfCapture(trx, captureId))];
        await deleteCapture(trx, captureId);
        await recordAudit(trx, {
          benchId: access.benchId,
          actorId: userId,
          action: 'capture.deleted',
          targetType: 'capture',
          targetId: captureId,
          details: { fileName: row.file_name, sha256: row.sha256 },
        });
      });
      for (const key of keys) {
        await storage.delete(key).catch((e: unknown) => deps.logger?.warn({ err: e, key }, 'removing a stored file failed'));
      }
    },
  };
}

export type CapturesService = ReturnType<typeof createCapturesService>;
