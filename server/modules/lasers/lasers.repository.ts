/** Data access for lasers (Knex only). Every query is scoped by bench id. */
import type { Knex } from 'knex';
import type { LaserType } from '../../contracts/lasers';

export interface LaserRow {
  id: string;
  bench_id: string;
  name: string;
  type: LaserType;
  wavelength_nm: number | null;
  frequency_thz: number | null;
  notes: string | null;
  created_at: Date;
  updated_at: Date;
}

export type LaserPatch = Partial<Pick<LaserRow, 'name' | 'type' | 'wavelength_nm' | 'frequency_thz' | 'notes'>> & {
  updated_at: Date;
};

export function listLasers(db: Knex, benchId: string): Promise<LaserRow[]> {
  return db<LaserRow>('lasers').where({ bench_id: benchId }).orderBy([
    { column: 'name', order: 'asc' },
    { column: 'id', order: 'asc' },
  ]);
}

export function findLaser(db: Knex, benchId: string, laserId: string): Promise<LaserRow | undefined> {
  return db<LaserRow>('lasers').where({ bench_id: benchId, id: laserId }).first();
}

export function findLaserByName(db: Knex, benchId: string, name: string): Promise<LaserRow | undefined> {
  return db<LaserRow>('lasers').where({ bench_id: benchId, name }).first();
}

export async function insertLaser(db: Knex, row: LaserRow): Promise<void> {
  await db<LaserRow>('lasers').insert(row);
}

export async function updateLaser(db: Knex, benchId: string, laserId: string, patch: LaserPatch): Promise<void> {
  await db<LaserRow>('lasers').where({ bench_id: benchId, id: laserId }).update(patch);
}

export async function deleteLaser(db: Knex, benchId: string, laserId: string): Promise<number> {
  return db<LaserRow>('lasers').where({ bench_id: benchId, id: laserId }).delete();
}
