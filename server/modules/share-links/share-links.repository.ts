/** Data access for share links (Knex only). Tokens are never stored, only their sha256. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface ShareLinkRow {
  id: string;
  bench_id: string;
  token_hash: string;
  analysis_id: string | null;
  overlay_id: string | null;
  created_by: string | null;
  created_at: Date;
  expires_at: Date | null;
  revoked_at: Date | null;
  revoked_by: string | null;
}

export async function insertShareLink(db: Knex, row: Omit<ShareLinkRow, 'revoked_at' | 'revoked_by'>): Promise<void> {
  await db('share_links').insert(row);
}

export async function findShareLinkByHash(db: Knex, tokenHash: string): Promise<ShareLinkRow | undefined> {
  return db('share_links').where({ token_hash: tokenHash }).first();
}

/** A link with the caller's role on its bench (null: not a member). */
export async function findShareLinkForUser(db: Knex, linkId: string, userId: string): Promise<(ShareLinkRow & { role: BenchRole | null }) | undefined> {
  return db('share_links as s')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 's.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('s.id', linkId)
    .first('s.*', 'm.role as role');
}

/** Sets revoked_at once; false when it was revoked already. */
export async function revokeShareLink(db: Knex, linkId: string, userId: string): Promise<boolean> {
  const n = await db('share_links').where({ id: linkId }).whereNull('revoked_at').update({ revoked_at: db.raw('CURRENT_TIMESTAMP(3)'), revoked_by: userId });
  return n > 0;
}

export interface ShareLinkListRow extends ShareLinkRow {
  file_name: string | null;
  overlay_name: string | null;
  created_by_name: string | null;
}

export async function listShareLinks(db: Knex, benchId: string): Promise<ShareLinkListRow[]> {
  return db('share_links as s')
    .leftJoin('analyses as a', 'a.id', 's.analysis_id')
    .leftJoin('captures as c', 'c.id', 'a.capture_id')
    .leftJoin('overlays as o', 'o.id', 's.overlay_id')
    .leftJoin('users as u', 'u.id', 's.created_by')
    .where('s.bench_id', benchId)
    .orderBy([
      { column: 's.created_at', order: 'desc' },
      { column: 's.id', order: 'desc' },
    ])
    .select('s.*', 'c.file_name', 'o.name as overlay_name', 'u.name as created_by_name');
}
