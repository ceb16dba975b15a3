import { spawnSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { projectRoot } from '../../server/config/env';
import { DEMO_BENCH, DEMO_PASSWORD, seedDemo } from '../../scripts/seed-demo';
import { agent, closeTestDb, makeTestApp } from '../helpers/api-app';

afterAll(closeTestDb);

const { app, db, services } = makeTestApp();

async function counts() {
  const [[users], [benches], [members], [lasers]] = await Promise.all(
    ['users', 'benches', 'bench_members', 'lasers'].map((t) => db(t).count({ n: '*' })),
  );
  return { users: users.n, benches: benches.n, members: members.n, lasers: lasers.n };
}

describe('scripts/seed-demo.ts', () => {
  it('seeds the Larchmere bench with an owner, an analyst, a viewer and three lasers; a second run adds nothing', async () => {
    const first = await seedDemo(db, services);
    const before = await counts();
    const second = await seedDemo(db, services);
    expect(second).toEqual({ benchId: first.benchId, added: { people: 0, benches: 0, members: 0, lasers: 0, captures: 0 } });
    expect(await counts()).toEqual(before);

    const mira = agent(app);
    await mira.post('/api/auth/sign-in').send({ email: 'mira.kestner@example.org', password: DEMO_PASSWORD }).expect(200);
    const benches = (await mira.get('/api/benches')).body.benches.filter((b: { name: string }) => b.name === DEMO_BENCH.name);
    expect(benches).toHaveLength(1);
    expect(benches[0]).toMatchObject({ role: 'owner', memberCount: 3, laserCount: 3 });

    const members = (await mira.get(`/api/benches/${first.benchId}/members`)).body.members;
    expect(members.map((m: { email: string; role: string }) => [m.email, m.role]).sort()).toEqual([
      ['ines.vale@example.org', 'viewer'],
      ['mira.kestner@example.org', 'owner'],
      ['tomas.aalto@example.org', 'analyst'],
    ]);
    const lasers = (await mira.get(`/api/benches/${first.benchId}/lasers`)).body.lasers;
    expect(lasers.map((l: { name: string; type: string; wavelengthNm: number }) => [l.name, l.type, l.wavelengthNm])).toEqual([
      ['Heron FL-1560', 'fibre', 1560.61],
      ['Kestrel ECL-1550', 'external-cavity', 1550.12],
      ['Wren DFB-1549', 'dfb', 1549.32],
    ]);

    // the viewer signs in with the same demo password
    await agent(app).post('/api/auth/sign-in').send({ email: 'ines.vale@example.org', password: DEMO_PASSWORD }).expect(200);
  });

  it('refuses to run with NODE_ENV=production: one line, exit status 1', () => {
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed-demo.ts'], {
      cwd: projectRoot,
      env: { ...process.env, NODE_ENV: 'production' },
      encoding: 'utf8',
    });
    expect(run.status).toBe(1);
    expect(run.stdout).toBe('');
    expect(run.stderr).toBe('phaseloom: error: the demo seed does not run with NODE_ENV=production\n');
  });
});
