/** Data access for overlays and their traces (Knex only). */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface OverlayRow {
  id: string;
  bench_id: string;
  name: string;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
}

export interface OverlayListRow extends OverlayRow {
  trace_count: number;
}

export async function listOverlays(db: Knex, benchId: string): Promise<OverlayListRow[]> {
  return db('overlays as o')
    .where('o.bench_id', benchId)
    .orderBy([
      { column: 'o.updated_at', order: 'desc' },
      { column: 'o.id', order: 'desc' },
    ])
    .select('o.*', db.raw('(SELECT COUNT(*) FROM overlay_traces t WHERE t.overlay_id = o.id) AS trace_count'));
}

/** An overlay with the caller's role on its bench (null: not a member). */
export async function findOverlayForUser(db: Knex, overlayId: string, userId: string): Promise<(OverlayRow & { role: BenchRole | null }) | undefined> {
  return db('overlays as o')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'o.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('o.id', overlayId)
    .first('o.*', 'm.role as role');
}

export async function findOverlay(db: Knex, overlayId: string): Promise<OverlayRow | undefined> {
  return db('overlays').where({ id: overlayId }).first();
}

/** Analysis ids of the overlay in plot order. */
export async function listTraceIds(db: Knex, overlayId: string): Promise<string[]> {
  const rows: { analysis_id: string }[] = await db('overlay_traces').where({ overlay_id: overlayId }).orderBy('position', 'asc').select('analysis_id');
  return rows.map((r) => r.analysis_id);
}

export async function insertOverlay(db: Knex, row: Omit<OverlayRow, 'updated_at'>, analysisIds: readonly string[]): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('overlays').insert({ ...row, updated_at: row.created_at });
    await trx('overlay_traces').insert(analysisIds.map((analysis_id, position) => ({ overlay_id: row.id, position, analysis_id })));
  });
}

export async function updateOverlay(db: Knex, overlayId: string, patch: { name?: string; analysisIds?: readonly string[] }): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('overlays')
      .where({ id: overlayId })
      .update({ ...(patch.name !== undefined ? { name: patch.name } : {}), updated_at: trx.raw('CURRENT_TIMESTAMP(3)') });
    if (patch.analysisIds) {
      await trx('overlay_traces').where({ overlay_id: overlayId }).delete();
      await trx('overlay_traces').insert(patch.analysisIds.map((analysis_id, position) => ({ overlay_id: overlayId, position, analysis_id })));
    }
  });
}

export async function deleteOverlay(db: Knex, overlayId: string): Promise<void> {
  await db('overlays').where({ id: overlayId }).delete();
}
