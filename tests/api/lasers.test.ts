import { afterAll, describe, expect, it } from 'vitest';
import { LaserListResponse, LaserResponse } from '../../server/contracts/lasers';
import { closeTestDb, createBench, errorOf, makeTestApp, signUp } from '../helpers/api-app';

afterAll(closeTestDb);

const { app } = makeTestApp();

async function ownerWithBench() {
  const owner = await signUp(app, 'owner');
  const benchId = await createBench(owner, 'Laser bench');
  return { owner, benchId, base: `/api/benches/${benchId}/lasers` };
}

describe('lasers CRUD', () => {
  it('POST creates a laser (201 {laser}) and GET lists it', async () => {
    const { owner, benchId, base } = await ownerWithBench();
    const res = await owner.agent.post(base).send({ name: 'ECL A', type: 'external-cavity', wavelengthNm: 1550.12, notes: ' quiet ' });
    expect(res.status).toBe(201);
    const { laser } = LaserResponse.parse(res.body);
    expect(laser).toMatchObject({ benchId, name: 'ECL A', type: 'external-cavity', wavelengthNm: 1550.12, notes: 'quiet' });
    expect(laser.createdAt).toBe(laser.updatedAt);
    const list = await owner.agent.get(base);
    expect(LaserListResponse.parse(list.body).lasers).toEqual([laser]);
    const one = await owner.agent.get(`${base}/${laser.id}`);
    expect(one.body.laser).toEqual(laser);
  });

  it('accepts neither unit: both are null', async () => {
    const { owner, base } = await ownerWithBench();
    const res = await owner.agent.post(base).send({ name: 'Unknown line', type: 'other' });
    expect(res.status).toBe(201);
    expect(res.body.laser).toMatchObject({ wavelengthNm: null, frequencyThz: null, notes: null });
  });

  it('refuses both units at once, naming frequencyThz', async () => {
    const { owner, base } = await ownerWithBench();
    const res = await owner.agent.post(base).send({ name: 'Both', type: 'dfb', wavelengthNm: 1550, frequencyThz: 193.4 });
    expect(res.status).toBe(400);
    expect(errorOf(res).details).toEqual([{ path: 'frequencyThz', message: 'give wavelengthNm or frequencyThz, not both' }]);
  });

  it('names each bad field: name, type, wavelengthNm', async () => {
    const { owner, base } = await ownerWithBench();
    const res = await owner.agent.post(base).send({ name: '', type: 'gas', wavelengthNm: -3 });
    expect(res.status).toBe(400);
    const error = errorOf(res);
    expect(error.code).toBe('validation_failed');
    expect(error.details!.map((d) => d.path).sort()).toEqual(['name', 'type', 'wavelengthNm']);
  });

  it('answers 409 for a second laser with the same name on the bench (case-insensitive); other benches may reuse it', async () => {
    const { owner, base } = await ownerWithBench();
    await owner.agent.post(base).send({ name: 'Twin', type: 'dfb' }).expect(201);
    const dup = await owner.agent.post(base).send({ name: 'twin', type: 'dbr' });
    expect(dup.status).toBe(409);
    expect(errorOf(dup)).toEqual({ code: 'conflict', message: 'this bench already has a laser named "twin"' });
    const other = await createBench(owner, 'Another bench');
    expect((await owner.agent.post(`/api/benches/${other}/lasers`).send({ name: 'Twin', type: 'dfb' })).status).toBe(201);
  });

  it('PATCH updates fields, keeps the others, and answers 409 when renaming onto another laser', async () => {
    const { owner, base } = await ownerWithBench();
    const a = (await owner.agent.post(base).send({ name: 'A', type: 'dfb', wavelengthNm: 1549.32 })).body.laser;
    await owner.agent.post(base).send({ name: 'B', type: 'dfb' }).expect(201);
    const res = await owner.agent.patch(`${base}/${a.id}`).send({ type: 'dbr', notes: 'mains spur at 50 Hz' });
    expect(res.status).toBe(200);
    expect(res.body.laser).toMatchObject({ id: a.id, name: 'A', type: 'dbr', wavelengthNm: 1549.32, notes: 'mains spur at 50 Hz' });
    expect(new Date(res.body.laser.updatedAt).getTime()).toBeGreaterThanOrEqual(new Date(a.updatedAt).getTime());
    const clash = await owner.agent.patch(`${base}/${a.id}`).send({ name: 'B' });
    expect(clash.status).toBe(409);
  });

  it('PATCH with null clears the nominal line and the notes', async () => {
    const { owner, base } = await ownerWithBench();
    const a = (await owner.agent.post(base).send({ name: 'A', type: 'fibre', frequencyThz: 192.1, notes: 'x' })).body.laser;
    const res = await owner.agent.patch(`${base}/${a.id}`).send({ wavelengthNm: null, notes: null });
    expect(res.status).toBe(200);
    expect(res.body.laser).toMatchObject({ wavelengthNm: null, frequencyThz: null, notes: null });
  });

  it('DELETE answers 204; the laser is gone (404 afterwards, also for a second DELETE)', async () => {
    const { owner, base } = await ownerWithBench();
    const a = (await owner.agent.post(base).send({ name: 'A', type: 'vcsel' })).body.laser;
    expect((await owner.agent.delete(`${base}/${a.id}`)).status).toBe(204);
    const get = await owner.agent.get(`${base}/${a.id}`);
    expect(get.status).toBe(404);
    expect(errorOf(get)).toEqual({ code: 'not_found', message: 'no such laser on this bench' });
    expect((await owner.agent.delete(`${base}/${a.id}`)).status).toBe(404);
  });

  it('a laser id from another bench is not found through this bench', async () => {
    const { owner, base } = await ownerWithBench();
    const otherBench = await createBench(owner, 'Other');
    const foreign = (await owner.agent.post(`/api/benches/${otherBench}/lasers`).send({ name: 'F', type: 'dfb' })).body.laser;
    expect((await owner.agent.get(`${base}/${foreign.id}`)).status).toBe(404);
    expect((await owner.agent.patch(`${base}/${foreign.id}`).send({ name: 'hijacked' })).status).toBe(404);
    expect((await owner.agent.delete(`${base}/${foreign.id}`)).status).toBe(404);
    expect((await owner.agent.get(`/api/benches/${otherBench}/lasers/${foreign.id}`)).body.laser.name).toBe('F');
  });
});

// c = 299 792 458 m/s exactly; ν[THz] = c / λ[nm] / 1000. Check value from the ITU-T G.694.1 grid anchor:
// 193.1 THz ↔ 1552.5244 nm (METHODS.md §8, checked there with numpy/scipy constants).
describe('nominal line: wavelength ↔ frequency with the exact speed of light', () => {
  it('frequencyThz 193.1 gives wavelengthNm 1552.5244 (ITU-T G.694.1 anchor)', async () => {
    const { owner, base } = await ownerWithBench();
    const res = await owner.agent.post(base).send({ name: 'Grid anchor', type: 'dfb', frequencyThz: 193.1 });
    expect(res.status).toBe(201);
    expect(res.body.laser.frequencyThz).toBe(193.1);
    expect(res.body.laser.wavelengthNm).toBeCloseTo(1552.5244, 4);
  });

  it('wavelengthNm 1552.5244 gives frequencyThz 193.1', async () => {
    const { owner, base } = await ownerWithBench();
    const res = await owner.agent.post(base).send({ name: 'Grid anchor by λ', type: 'dfb', wavelengthNm: 1552.5244 });
    expect(res.body.laser.wavelengthNm).toBe(1552.5244);
    // 1552.5244 is rounded to 0.1 pm, i.e. ±6 MHz at this wavelength: ±6e-6 THz
    expect(res.body.laser.frequencyThz).toBeCloseTo(193.1, 5);
  });

  it('PATCH with a new wavelength recomputes the frequency; with a new frequency, the wavelength', async () => {
    const { owner, base } = await ownerWithBench();
    const a = (await owner.agent.post(base).send({ name: 'Tunable', type: 'external-cavity', wavelengthNm: 1550 })).body.laser;
    const byFrequency = await owner.agent.patch(`${base}/${a.id}`).send({ frequencyThz: 193.1 });
    expect(byFrequency.body.laser.wavelengthNm).toBeCloseTo(1552.5244, 4);
    const byWavelength = await owner.agent.patch(`${base}/${a.id}`).send({ wavelengthNm: 1552.5244 });
    expect(byWavelength.body.laser.frequencyThz).toBeCloseTo(193.1, 5);
  });
});
