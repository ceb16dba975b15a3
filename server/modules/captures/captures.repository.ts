/** Data access for captures (Knex only). Bench-scoped reads are filtered by bench id; id lookups join the caller's membership. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';
import type { AnalysisStatus } from '../../contracts/analyses';
import type { ByteOrder, CaptureFormat, CaptureKind, CaptureSetup, RawDtype, SetupParams } from '../../contracts/captures';

export interface CaptureRow {
  id: string;
  bench_id: string;
  laser_id: string | null;
  uploaded_by: string | null;
  file_name: string;
  storage_key: string;
  size_bytes: number | string;
  sha256: string;
  format: CaptureFormat;
  kind: CaptureKind;
  sample_rate_hz: number | null;
  dtype: RawDtype | null;
  channels: number | null;
  byte_order: ByteOrder | null;
  setup: CaptureSetup | null;
  /** JSON text as read; an object or null when written */
  setup_params: string | SetupParams | null;
  drive_current_ma: number | null;
  temperature_c: number | null;
  output_power_mw: number | null;
  notes: string | null;
  tags: string | string[] | null;
  duplicate_of: string | null;
  created_at: Date;
}

export interface CaptureRowWithNames extends CaptureRow {
  uploaded_by_name: string | null;
}

export interface LatestAnalysisColumns {
  a_id: string | null;
  a_status: AnalysisStatus | null;
  a_progress: number | null;
  a_stage: string | null;
  a_intrinsic_linewidth_hz: number | null;
  a_beta_linewidth_hz: number | null;
  a_lineshape_fwhm_hz: number | null;
}

export type CaptureListRow = CaptureRowWithNames & LatestAnalysisColumns;

export interface CaptureFilter {
  benchId: string;
  laserId?: string;
  kind?: CaptureKind;
  tag?: string;
}

function withNames(db: Knex) {
  return db('captures as c').leftJoin('users as u', 'u.id', 'c.uploaded_by').select('c.*', 'u.name as uploaded_by_name');
}

function applyFilter(q: Knex.QueryBuilder, f: CaptureFilter): Knex.QueryBuilder {
  q.where('c.bench_id', f.benchId);
  if (f.laserId) q.andWhere('c.laser_id', f.laserId);
  if (f.kind) q.andWhere('c.kind', f.kind);
  if (f.tag) q.andWhereRaw('JSON_CONTAINS(c.tags, JSON_QUOTE(?))', [f.tag]);
  return q;
}

export async function listCaptures(
  db: Knex,
  filter: CaptureFilter,
  page: { limit: number; offset: number },
): Promise<{ rows: CaptureListRow[]; total: number }> {
  const rows = (await applyFilter(withNames(db), filter)
    .joinRaw(
      `LEFT JOIN analyses a ON a.id = (SELECT a2.id FROM analyses a2 WHERE a2.capture_id = c.id
         ORDER BY a2.created_at DESC, a2.id DESC LIMIT 1)`,
    )
    .select(
      'a.id as a_id',
      'a.status as a_status',
      'a.progress as a_progress',
      'a.stage as a_stage',
      'a.intrinsic_linewidth_hz as a_intrinsic_linewidth_hz',
      'a.beta_linewidth_hz as a_beta_linewidth_hz',
      'a.lineshape_fwhm_hz as a_lineshape_fwhm_hz',
    )
    .orderBy([
      { column: 'c.created_at', order: 'desc' },
      { column: 'c.id', order: 'desc' },
    ])
    .limit(page.limit)
    .offset(page.offset)) as CaptureListRow[];
  const [{ n }] = (await applyFilter(db('captures as c'), filter).count({ n: '*' })) as { n: number | string }[];
  return { rows, total: Number(n) };
}

/** The capture with the caller's role on its bench (null when not a member); undefined when there is no such capture. */
export async function findCaptureForUser(
  db: Knex,
  captureId: string,
  userId: string,
): Promise<(CaptureRowWithNames & { role: BenchRole | null }) | undefined> {
  return withNames(db)
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'c.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .select('m.role as role')
    .where('c.id', captureId)
    .first();
}

export async function findCaptureWithNames(db: Knex, captureId: string): Promise<CaptureRowWithNames | undefined> {
  return withNames(db).where('c.id', captureId).first();
}

export async function findCaptureByFileName(db: Knex, benchId: string, fileName: string): Promise<CaptureRowWithNames | undefined> {
  return withNames(db)
    .where({ 'c.bench_id': benchId, 'c.file_name': fileName })
    .orderBy([
      { column: 'c.created_at', order: 'asc' },
      { column: 'c.id', order: 'asc' },
    ])
    .first();
}

/** The earliest capture on the bench with these bytes, if any. */
export async function findFirstWithSha256(db: Knex, benchId: string, sha256: string): Promise<string | null> {
  const row = (await db('captures')
    .where({ bench_id: benchId, sha256 })
    .orderBy([
      { column: 'created_at', order: 'asc' },
      { column: 'id', order: 'asc' },
    ])
    .first('id')) as { id: string } | undefined;
  return row?.id ?? null;
}

export async function insertCapture(db: Knex, row: CaptureRow): Promise<void> {
  await db('captures').insert({
    ...row,
    setup_params: row.setup_params === null ? null : JSON.stringify(row.setup_params),
    tags: JSON.stringify(row.tags ?? []),
  });
}

/** Storage keys of the capture's file and of its analyses' series. */
export async function storageKeysOfCapture(db: Knex, captureId: string): Promise<string[]> {
  const rows = (await db('analyses').where({ capture_id: captureId }).whereNotNull('series_key').select('series_key')) as {
    series_key: string;
  }[];
  return rows.map((r) => r.series_key);
}

export async function deleteCapture(db: Knex, captureId: string): Promise<number> {
  return db('captures').where({ id: captureId }).delete();
}
