/**
 * The public side of share links: GET /api/shared/:token, no sign-in. The token's sha256 finds the
 * link; an unknown token is 404, a revoked or expired one is "gone" (410). The reply holds only what
 * the shared page shows — the plot's display series, figures, settings, marks and provenance of each
 * spectrum — and nothing else of the bench (no bench id, no member names or e-mails, no other captures).
 */
import type { Knex } from 'knex';
import type { SharedMark, SharedResponse, SharedTrace } from '../../contracts/share-links';
import { overlayColor } from '../../contracts/overlays';
import { notFound } from '../../errors';
import { listMarksOfCapture } from '../marks/marks.repository';
import { findOverlay, listTraceIds } from '../overlays/overlays.repository';
import { findTraceRows, iso, operatingPoint, traceFigures, traceSeries, traceSettings, type TraceRow } from '../overlays/trace-rows';
import { findShareLinkByHash } from '../share-links/share-links.repository';
import { shareLinkState } from '../share-links/share-links.service';
import { hashShareToken, isTokenShape } from '../share-links/share-token';

export const SHARED_NOT_FOUND = 'no such shared link; check that the address was copied whole';

export type SharedOutcome = { gone: false; body: SharedResponse } | { gone: true; message: string };

async function marksOf(db: Knex, captureId: string): Promise<SharedMark[]> {
  const rows = await listMarksOfCapture(db, captureId);
  return rows.map((m) => ({
    kind: m.kind,
    text: m.text,
    frequencyHz: m.hi_hz === null ? m.lo_hz : null,
    bandHz: m.hi_hz === null ? null : [m.lo_hz, m.hi_hz],
  }));
}

async function sharedTrace(db: Knex, row: TraceRow, position: number): Promise<SharedTrace> {
  return {
    color: overlayColor(position),
    label: row.laser_name ? `${row.file_name} · ${row.laser_name}` : row.file_name,
    figures: traceFigures(row),
    settings: traceSettings(row),
    provenance: {
      fileName: row.file_name,
      sha256: row.sha256,
      kind: row.kind,
      format: row.format,
      sampleRateHz: row.sample_rate_hz,
      capturedAt: iso(row.captured_at) as string,
      analysedAt: iso(row.finished_at),
      laserName: row.laser_name,
      operatingPoint: operatingPoint(row),
    },
    series: traceSeries(row),
    marks: await marksOf(db, row.capture_id),
  };
}

export function createSharedService(db: Knex) {
  return {
    async open(token: string, now = Date.now()): Promise<SharedOutcome> {
      if (!isTokenShape(token)) throw notFound(SHARED_NOT_FOUND);
      const link = await findShareLinkByHash(db, hashShareToken(token));
      if (!link) throw notFound(SHARED_NOT_FOUND);
      const state = shareLinkState(link, now);
      if (state === 'revoked') return { gone: true, message: 'this shared link was revoked by the bench that made it; ask them for a new one' };
      if (state === 'expired') return { gone: true, message: 'this shared link has expired; ask the bench that made it for a new one' };
      const expiresAt = iso(link.expires_at);
      if (link.analysis_id) {
        const [row] = await findTraceRows(db, [link.analysis_id]);
        if (!row) throw notFound(SHARED_NOT_FOUND);
        return { gone: false, body: { kind: 'analysis', title: row.file_name, expiresAt, traces: [await sharedTrace(db, row, 0)] } };
      }
      const overlay = link.overlay_id ? await findOverlay(db, link.overlay_id) : undefined;
      if (!overlay) throw notFound(SHARED_NOT_FOUND);
      const ids = await listTraceIds(db, overlay.id);
      const rows = new Map((await findTraceRows(db, ids)).map((r) => [r.analysis_id, r]));
      const traces: SharedTrace[] = [];
      for (const [position, id] of ids.entries()) {
        const row = rows.get(id);
        if (row) traces.push(await sharedTrace(db, row, position));
      }
      return { gone: false, body: { kind: 'overlay', title: overlay.name, expiresAt, traces } };
    },
  };
}

export type SharedService = ReturnType<typeof createSharedService>;
