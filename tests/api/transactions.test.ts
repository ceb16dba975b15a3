import { afterAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeTestApp, signUp } from '../helpers/api-app';

afterAll(closeTestDb);

const { app, db, services } = makeTestApp();

describe('multi-row writes are all or nothing', () => {
  it('benches.create leaves no bench behind when the owner membership cannot be written', async () => {
    // the bench row goes in first; the membership row then fails its foreign key (no such user)
    const name = `Half-made bench ${Date.now()}`;
    await expect(services.benches.create('zzzzzzzzzzzzzzzzzzzzzzzz', { name })).rejects.toThrow(/foreign key/i);
    expect(await db('benches').where({ name })).toEqual([]);
  });

  it('benches.create writes the bench and its owner together', async () => {
    const mira = await signUp(app);
    const bench = await services.benches.create(mira.user.id, { name: 'Whole bench' });
    expect(await db('benches').where({ id: bench.id })).toHaveLength(1);
    expect(await db('bench_members').where({ bench_id: bench.id })).toEqual([
      expect.objectContaining({ user_id: mira.user.id, role: 'owner' }),
    ]);
  });

  it('a refused role change (last owner) leaves every membership as it was', async () => {
    const mira = await signUp(app);
    const bench = await services.benches.create(mira.user.id, { name: 'Locked bench' });
    const before = await db('bench_members').where({ bench_id: bench.id });
    const access = { benchId: bench.id, userId: mira.user.id, role: 'owner' as const };
    await expect(services.members.changeRole(access, mira.user.id, { role: 'viewer' })).rejects.toMatchObject({ status: 409 });
    expect(await db('bench_members').where({ bench_id: bench.id })).toEqual(before);
  });
});
