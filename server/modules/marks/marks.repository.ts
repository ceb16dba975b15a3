/** Data access for marks (Knex only). Id lookups join the caller's membership of the capture's bench. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';
import type { MarkKind } from '../../contracts/marks';

export interface MarkRow {
  id: string;
  capture_id: string;
  author_id: string | null;
  kind: MarkKind;
  text: string;
  lo_hz: number;
  hi_hz: number | null;
  created_at: Date;
  updated_at: Date;
}

export interface MarkRowWithAuthor extends MarkRow {
  author_name: string | null;
}

function withAuthor(db: Knex) {
  return db('marks as k').leftJoin('users as u', 'u.id', 'k.author_id').select('k.*', 'u.name as author_name');
}

/** A capture's marks, lowest frequency first. */
export async function listMarksOfCapture(db: Knex, captureId: string): Promise<MarkRowWithAuthor[]> {
  return withAuthor(db)
    .where('k.capture_id', captureId)
    .orderBy([
      { column: 'k.lo_hz', order: 'asc' },
      { column: 'k.created_at', order: 'asc' },
      { column: 'k.id', order: 'asc' },
    ]);
}

export async function findMarkWithAuthor(db: Knex, markId: string): Promise<MarkRowWithAuthor | undefined> {
  return withAuthor(db).where('k.id', markId).first();
}

/** The mark with its capture's bench and the caller's role there (null: not a member). */
export async function findMarkForUser(
  db: Knex,
  markId: string,
  userId: string,
): Promise<(MarkRow & { bench_id: string; role: BenchRole | null }) | undefined> {
  return db('marks as k')
    .join('captures as c', 'c.id', 'k.capture_id')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'c.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('k.id', markId)
    .first('k.*', 'c.bench_id', 'm.role as role');
}

/**
 * Where marks may be placed on a capture: the lowest frequency of its latest done analysis (the
 * first point of the display series, which keeps the lowest bins as they are) and that analysis's
 * sample rate. Undefined when no analysis of the capture is done.
 */
export async function findLatestDoneSpectrumRange(
  db: Knex,
  captureId: string,
): Promise<{ lowestHz: number | null; highestHz: number | null; sampleRateHz: number | null } | undefined> {
  const row = (await db('analyses')
    .where({ capture_id: captureId, status: 'done' })
    .orderBy([
      { column: 'finished_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .first('display_series', 'result')) as { display_series: string | object | null; result: string | object | null } | undefined;
  if (!row) return undefined;
  const parse = (v: string | object | null) => (v === null ? null : typeof v === 'string' ? JSON.parse(v) : v) as Record<string, unknown> | null;
  const series = parse(row.display_series) as { frequencyHz?: number[] } | null;
  const result = parse(row.result) as { input?: { sampleRateHz?: number } } | null;
  const f = (series?.frequencyHz ?? []).filter((x) => Number.isFinite(x) && x > 0);
  return {
    lowestHz: f.length ? f[0] : null,
    highestHz: f.length ? f[f.length - 1] : null,
    sampleRateHz: typeof result?.input?.sampleRateHz === 'number' ? result.input.sampleRateHz : null,
  };
}

export async function insertMark(db: Knex, row: Omit<MarkRow, 'created_at' | 'updated_at'> & { created_at: Date }): Promise<void> {
  await db('marks').insert({ ...row, updated_at: row.created_at });
}

export async function updateMark(
  db: Knex,
  markId: string,
  patch: Partial<Pick<MarkRow, 'kind' | 'text' | 'lo_hz' | 'hi_hz'>>,
): Promise<void> {
  await db('marks').where({ id: markId }).update({ ...patch, updated_at: new Date() });
}

export async function deleteMark(db: Knex, markId: string): Promise<void> {
  await db('marks').where({ id: markId }).delete();
}
