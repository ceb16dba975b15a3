/**
 * Lasers on a bench: members read, owners and analysts write. Names are unique per bench (409).
 * The nominal line is stored in both units; the one not given is derived with the exact c
 * (optical-units.ts).
 */
import type { Knex } from 'knex';
import type { CreateLaserRequest, Laser, UpdateLaserRequest } from '../../contracts/lasers';
import { conflict, notFound } from '../../errors';
import { isDuplicateKeyError } from '../../lib/db-errors';
import { newId } from '../../lib/ids';
import { assertCan, type BenchAccess } from '../benches/bench-policy';
import {
  deleteLaser,
  findLaser,
  findLaserByName,
  insertLaser,
  listLasers,
  updateLaser,
  type LaserPatch,
  type LaserRow,
} from './lasers.repository';
import { nominalLine } from './optical-units';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type CreateLaserInput = Parsed<typeof CreateLaserRequest>;
export type UpdateLaserInput = Parsed<typeof UpdateLaserRequest>;

export const LASER_NOT_FOUND = 'no such laser on this bench';

function toLaser(row: LaserRow): Laser {
  return {
    id: row.id,
    benchId: row.bench_id,
    name: row.name,
    type: row.type,
    wavelengthNm: row.wavelength_nm,
    frequencyThz: row.frequency_thz,
    notes: row.notes,
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

function duplicateName(name: string) {
  return conflict(`this bench already has a laser named "${name}"`);
}

export function createLasersService(db: Knex) {
  async function get(access: BenchAccess, laserId: string): Promise<Laser> {
    assertCan(access, 'lasers.read');
    const row = await findLaser(db, access.benchId, laserId);
    if (!row) throw notFound(LASER_NOT_FOUND);
    return toLaser(row);
  }

  return {
    async list(access: BenchAccess): Promise<Laser[]> {
      assertCan(access, 'lasers.read');
      return (await listLasers(db, access.benchId)).map(toLaser);
    },

    get,

    /** The laser with this name on the bench, or null (used by the demo seed to stay idempotent). */
    async findByName(access: BenchAccess, name: string): Promise<Laser | null> {
      assertCan(access, 'lasers.read');
      const row = await findLaserByName(db, access.benchId, name);
      return row ? toLaser(row) : null;
    },

    async create(access: BenchAccess, input: CreateLaserInput): Promise<Laser> {
      assertCan(access, 'lasers.write');
      const line = nominalLine(input);
      const now = new Date();
      const row: LaserRow = {
        id: newId(),
        bench_id: access.benchId,
        name: input.name,
        type: input.type,
        wavelength_nm: line.wavelengthNm,
        frequency_thz: line.frequencyThz,
        notes: input.notes ?? null,
        created_at: now,
        updated_at: now,
      };
      try {
        await insertLaser(db, row);
      } catch (e) {
        if (isDuplicateKeyError(e)) throw duplicateName(input.name);
        throw e;
      }
      return toLaser(row);
    },

    async update(access: BenchAccess, laserId: string, input: UpdateLaserInput): Promise<Laser> {
      assertCan(access, 'lasers.write');
      const existing = await findLaser(db, access.benchId, laserId);
      if (!existing) throw notFound(LASER_NOT_FOUND);
      const patch: LaserPatch = { updated_at: new Date() };
      if (input.name !== undefined) patch.name = input.name;
      if (input.type !== undefined) patch.type = input.type;
      if (input.notes !== undefined) patch.notes = input.notes;
      if (input.wavelengthNm !== undefined || input.frequencyThz !== undefined) {
        // a number sets both units; null (with no number beside it) clears both
        const line = nominalLine(input);
        patch.wavelength_nm = line.wavelengthNm;
        patch.frequency_thz = line.frequencyThz;
      }
      try {
        await updateLaser(db, access.benchId, laserId, patch);
      } catch (e) {
        if (isDuplicateKeyError(e)) throw duplicateName(input.name ?? existing.name);
        throw e;
      }
      return get(access, laserId);
    },

    async remove(access: BenchAccess, laserId: string): Promise<void> {
      assertCan(access, 'lasers.write');
      const deleted = await deleteLaser(db, access.benchId, laserId);
      if (deleted === 0) throw notFound(LASER_NOT_FOUND);
    },
  };
}

export type LasersService = ReturnType<typeof createLasersService>;
