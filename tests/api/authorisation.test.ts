/**
 * Authorisation, table-driven: every bench-scoped route, tried by each role of the bench and by a
 * member of another bench, on a fresh bench with real ids. Allowed → the route's success status;
 * refused member → 403 forbidden; outsider → 404 not_found with none of the bench's data, and nothing
 * changes in the database after a refused request.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BenchRole } from '../../server/contracts/benches';
import { agent, closeTestDb, createBench, errorOf, makeTestApp, signUp, type SignedIn } from '../helpers/api-app';

afterAll(closeTestDb);

const { app, db, services } = makeTestApp();

type Actor = BenchRole | 'outsider';

interface World {
  benchId: string;
  benchName: string;
  laserId: string;
  laserName: string;
  /** a viewer on the bench who is the target of member changes */
  targetId: string;
}

interface Route {
  name: string;
  method: 'get' | 'post' | 'patch' | 'delete';
  path: (w: World, actor: SignedIn) => string;
  body?: () => object;
  success: number;
  /** actors allowed; the others get 403 (members) or 404 (outsider) */
  allowed: BenchRole[];
  /** what an allowed actor gets instead of `success`, when a rule other than the role applies */
  special?: Partial<Record<BenchRole, number>>;
}

const ALL: BenchRole[] = ['owner', 'analyst', 'viewer'];

const ROUTES: Route[] = [
  { name: 'GET bench', method: 'get', path: (w) => `/api/benches/${w.benchId}`, success: 200, allowed: ALL },
  { name: 'PATCH bench', method: 'patch', path: (w) => `/api/benches/${w.benchId}`, body: () => ({ name: 'Renamed' }), success: 200, allowed: ['owner'] },
  { name: 'DELETE bench', method: 'delete', path: (w) => `/api/benches/${w.benchId}`, success: 204, allowed: ['owner'] },
  { name: 'GET members', method: 'get', path: (w) => `/api/benches/${w.benchId}/members`, success: 200, allowed: ALL },
  {
    name: 'POST member',
    method: 'post',
    path: (w) => `/api/benches/${w.benchId}/members`,
    body: () => ({ email: people.newcomer.user.email, role: 'viewer' }),
    success: 201,
    allowed: ['owner'],
  },
  {
    name: 'PATCH member',
    method: 'patch',
    path: (w) => `/api/benches/${w.benchId}/members/${w.targetId}`,
    body: () => ({ role: 'analyst' }),
    success: 200,
    allowed: ['owner'],
  },
  { name: 'DELETE another member', method: 'delete', path: (w) => `/api/benches/${w.benchId}/members/${w.targetId}`, success: 204, allowed: ['owner'] },
  {
    name: 'DELETE myself (leave)',
    method: 'delete',
    path: (w, actor) => `/api/benches/${w.benchId}/members/${actor.user.id}`,
    success: 204,
    allowed: ALL,
    special: { owner: 409 }, // the only owner cannot leave
  },
  { name: 'GET lasers', method: 'get', path: (w) => `/api/benches/${w.benchId}/lasers`, success: 200, allowed: ALL },
  {
    name: 'POST laser',
    method: 'post',
    path: (w) => `/api/benches/${w.benchId}/lasers`,
    body: () => ({ name: 'New laser', type: 'dfb', wavelengthNm: 1550 }),
    success: 201,
    allowed: ['owner', 'analyst'],
  },
  { name: 'GET laser', method: 'get', path: (w) => `/api/benches/${w.benchId}/lasers/${w.laserId}`, success: 200, allowed: ALL },
  {
    name: 'PATCH laser',
    method: 'patch',
    path: (w) => `/api/benches/${w.benchId}/lasers/${w.laserId}`,
    body: () => ({ notes: 'edited' }),
    success: 200,
    allowed: ['owner', 'analyst'],
  },
  { name: 'DELETE laser', method: 'delete', path: (w) => `/api/benches/${w.benchId}/lasers/${w.laserId}`, success: 204, allowed: ['owner', 'analyst'] },
];

let people: Record<BenchRole | 'target' | 'newcomer' | 'outsider', SignedIn>;
let outsiderBenchId: string;

beforeAll(async () => {
  const [owner, analyst, viewer, target, newcomer, outsider] = await Promise.all(
    ['owner', 'analyst', 'viewer', 'target', 'newcomer', 'outsider'].map((who) => signUp(app, who)),
  );
  people = { owner, analyst, viewer, target, newcomer, outsider };
  // the outsider is a full owner of a bench of their own, with a laser on it
  outsiderBenchId = await createBench(outsider, 'Outsider bench');
  await outsider.agent.post(`/api/benches/${outsiderBenchId}/lasers`).send({ name: 'Outsider laser', type: 'dfb' });
});

let worldCount = 0;

/** A fresh bench: owner, analyst, viewer and a target viewer; one laser. Made through the services. */
async function freshWorld(): Promise<World> {
  worldCount += 1;
  const benchName = `Secret bench ${worldCount}`;
  const laserName = `Secret laser ${worldCount}`;
  const bench = await services.benches.create(people.owner.user.id, { name: benchName, description: 'confidential notes' });
  const access = { benchId: bench.id, userId: people.owner.user.id, role: 'owner' as const };
  await services.members.add(access, { email: people.analyst.user.email, role: 'analyst' });
  await services.members.add(access, { email: people.viewer.user.email, role: 'viewer' });
  await services.members.add(access, { email: people.target.user.email, role: 'viewer' });
  const laser = await services.lasers.create(access, { name: laserName, type: 'fibre', wavelengthNm: 1560.61 });
  return { benchId: bench.id, benchName, laserId: laser.id, laserName, targetId: people.target.user.id };
}

async function snapshot(benchId: string) {
  return {
    bench: await db('benches').where({ id: benchId }).first(),
    members: await db('bench_members').where({ bench_id: benchId }).orderBy('user_id'),
    lasers: await db('lasers').where({ bench_id: benchId }).orderBy('id'),
  };
}

function send(route: Route, actor: SignedIn, world: World) {
  const req = actor.agent[route.method](route.path(world, actor));
  return route.body ? req.send(route.body()) : req;
}

const ACTORS: Actor[] = ['owner', 'analyst', 'viewer', 'outsider'];

const CASES = ROUTES.flatMap((route) =>
  ACTORS.map((actor) => {
    let expected: number;
    if (actor === 'outsider') expected = 404;
    else if (route.allowed.includes(actor)) expected = route.special?.[actor] ?? route.success;
    else expected = 403;
    return { route, actor, expected };
  }),
);

describe('every bench-scoped route, for every role and for a member of another bench', () => {
  it.each(CASES.map((c) => [c.route.name, c.actor, c.expected, c] as const))(
    '%s as %s → %i',
    async (_name, actor, expected, { route }) => {
      const world = await freshWorld();
      const before = await snapshot(world.benchId);
      const res = await send(route, people[actor], world);
      expect(res.status).toBe(expected);

      if (expected === 403) expect(errorOf(res).code).toBe('forbidden');
      if (expected === 404) {
        expect(errorOf(res).code).toBe('not_found');
        // nothing about the bench leaks: not its name, description, laser, or members
        for (const secret of [world.benchName, 'confidential notes', world.laserName, people.target.user.email, world.laserId]) {
          expect(res.text).not.toContain(secret);
        }
      }
      if (expected >= 400) expect(await snapshot(world.benchId)).toEqual(before);
    },
  );
});

describe('a member of another bench using their own bench with ids from this one', () => {
  const CROSS: { name: string; method: Route['method']; path: (w: World) => string; body?: object }[] = [
    { name: 'GET laser', method: 'get', path: (w) => `/api/benches/${outsiderBenchId}/lasers/${w.laserId}` },
    { name: 'PATCH laser', method: 'patch', path: (w) => `/api/benches/${outsiderBenchId}/lasers/${w.laserId}`, body: { notes: 'x' } },
    { name: 'DELETE laser', method: 'delete', path: (w) => `/api/benches/${outsiderBenchId}/lasers/${w.laserId}` },
    { name: 'PATCH member', method: 'patch', path: (w) => `/api/benches/${outsiderBenchId}/members/${w.targetId}`, body: { role: 'owner' } },
    { name: 'DELETE member', method: 'delete', path: (w) => `/api/benches/${outsiderBenchId}/members/${w.targetId}` },
  ];

  it.each(CROSS.map((c) => [c.name, c] as const))('%s → 404 and nothing changes', async (_name, c) => {
    const world = await freshWorld();
    const before = await snapshot(world.benchId);
    let req = people.outsider.agent[c.method](c.path(world));
    if (c.body) req = req.send(c.body);
    const res = await req;
    expect(res.status).toBe(404);
    expect(errorOf(res).code).toBe('not_found');
    expect(res.text).not.toContain(world.laserName);
    expect(await snapshot(world.benchId)).toEqual(before);
  });

  it('GET /api/benches does not list benches the caller is not a member of', async () => {
    const world = await freshWorld();
    const res = await people.outsider.agent.get('/api/benches');
    expect(res.body.benches.map((b: { id: string }) => b.id)).not.toContain(world.benchId);
    expect(res.text).not.toContain(world.benchName);
  });
});

describe('signed out', () => {
  it.each(ROUTES.map((r) => [r.name, r] as const))('%s without a session → 401 unauthenticated', async (_name, route) => {
    const world = await freshWorld();
    const anonymous = { ...people.outsider, agent: agent(app) };
    const res = await send(route, anonymous, world);
    expect(res.status).toBe(401);
    expect(errorOf(res).code).toBe('unauthenticated');
  });
});
