/**
 * Benches: list mine, create (the creator becomes owner, in one transaction), read, rename or
 * describe (owner), delete with everything on it (owner). Also resolves a caller's access to a bench.
 */
import type { Knex } from 'knex';
import type { Bench, BenchSummary, CreateBenchRequest, UpdateBenchRequest } from '../../contracts/benches';
import { notFound } from '../../errors';
import { newId } from '../../lib/ids';
import { assertCan, type BenchAccess } from './bench-policy';
import {
  deleteBench,
  findBenchForMember,
  findRole,
  insertBench,
  insertMembership,
  listBenchesForMember,
  updateBench,
  type BenchWithRoleRow,
} from './benches.repository';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type CreateBenchInput = Parsed<typeof CreateBenchRequest>;
export type UpdateBenchInput = Parsed<typeof UpdateBenchRequest>;

export const BENCH_NOT_FOUND = 'no such bench, or you are not a member of it';

const ID_PATTERN = /^[a-z2-7]{24}$/;

function toBench(row: BenchWithRoleRow): Bench {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    role: row.role,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

export function createBenchesService(db: Knex) {
  async function get(access: BenchAccess): Promise<Bench> {
    assertCan(access, 'bench.read');
    const row = await findBenchForMember(db, access.benchId, access.userId);
    if (!row) throw notFound(BENCH_NOT_FOUND);
    return toBench(row);
  }

  return {
    /** The caller's membership, or 404 for non-members and unknown ids alike (existence is not revealed). */
    async resolveAccess(userId: string, benchId: string): Promise<BenchAccess> {
      if (!ID_PATTERN.test(benchId)) throw notFound(BENCH_NOT_FOUND);
      const role = await findRole(db, benchId, userId);
      if (!role) throw notFound(BENCH_NOT_FOUND);
      return { benchId, userId, role };
    },

    async list(userId: string): Promise<BenchSummary[]> {
      const rows = await listBenchesForMember(db, userId);
      return rows.map((r) => ({ ...toBench(r), memberCount: Number(r.member_count), laserCount: Number(r.laser_count) }));
    },

    async create(userId: string, input: CreateBenchInput): Promise<Bench> {
      const now = new Date();
      const id = newId();
      await db.transaction(async (trx) => {
        await insertBench(trx, { id, name: input.name, description: input.description ?? null, created_at: now });
        await insertMembership(trx, { bench_id: id, user_id: userId, role: 'owner', joined_at: now });
      });
      return { id, name: input.name, description: input.description ?? null, role: 'owner', createdAt: now.toISOString() };
    },

    get,

    async update(access: BenchAccess, input: UpdateBenchInput): Promise<Bench> {
      assertCan(access, 'bench.update');
      const patch: Parameters<typeof updateBench>[2] = { updated_at: new Date() };
      if (input.name !== undefined) patch.name = input.name;
      if (input.description !== undefined) patch.description = input.description;
      await updateBench(db, access.benchId, patch);
      return get(access);
    },

    /** Deletes the bench; members, lasers and everything else on it go with it (foreign keys cascade). */
    async remove(access: BenchAccess): Promise<void> {
      assertCan(access, 'bench.delete');
      await deleteBench(db, access.benchId);
    },
  };
}

export type BenchesService = ReturnType<typeof createBenchesService>;
