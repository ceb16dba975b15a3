/**
 * Capture routes on the real database and storage: upload (streamed, sha256, duplicates, the quick
 * engine check, the size cap, nothing half-stored), list with filters and pages, read, delete — for
 * every role, and 404 for members of other benches.
 */
import { createHash } from 'node:crypto';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import type { Express } from 'express';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeCapture } from '../../analysis/pipeline';
import { createApp } from '../../server/app';
import { loadEnv, projectRoot, type Env } from '../../server/config/env';
import { createServices } from '../../server/services';
import { createCapturesService } from '../../server/modules/captures/captures.service';
import { DEMO_CAPTURES, uploadDemoCaptures } from '../../server/modules/captures/demo-captures';
import { LocalDiskStorage } from '../../server/storage/local-disk-storage';
import type { Storage } from '../../server/storage/storage';
import {
  GENEROUS_LIMITS,
  PUBLIC_URL,
  addMember,
  agent,
  closeTestDb,
  createBench,
  errorOf,
  signUp,
  testDb,
  type Agent,
  type SignedIn,
} from '../helpers/api-app';
import { iqCapture } from '../helpers/api-captures';

const baseEnv = loadEnv();
const storageDir = baseEnv.storageDir;

function captureApp(options: { env?: Partial<Env>; storage?: Storage } = {}): Express {
  const db = testDb();
  return createApp({
    db,
    env: { ...baseEnv, PHASELOOM_PUBLIC_URL: PUBLIC_URL, ...options.env },
    logger: pino({ level: 'silent' }),
    services: createServices(db),
    rateLimits: GENEROUS_LIMITS,
    storage: options.storage,
  });
}


const IQ_FIELDS = { kind: 'iq', sampleRateHz: '100000', format: 'raw', dtype: 'float32', channels: '2' };

function upload(a: Agent, benchId: string, file: Buffer, name: string, fields: Record<string, string> = IQ_FIELDS) {
  let req = a.post(`/api/benches/${benchId}/captures`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', file, name);
}

/** Every file under the storage folder (captures, series, temporary uploads). */
function storedFiles(): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    let entries: string[];
    try {
      entries = readdirSync(dir);
    } catch {
      return;
    }
    for (const e of entries) {
      const p = path.join(dir, e);
      if (statSync(p).isDirectory()) walk(p);
      else out.push(path.relative(storageDir, p));
    }
  };
  walk(storageDir);
  return out.sort();
}

async function rowCounts(benchId: string) {
  const db = testDb();
  const [c] = await db('captures').where({ bench_id: benchId }).count({ n: '*' });
  const [a] = await db('analyses as a').join('captures as c', 'c.id', 'a.capture_id').where('c.bench_id', benchId).count({ n: '*' });
  return { captures: Number(c.n), analyses: Number(a.n) };
}

/** The engine's own message for these bytes and options (what the CLI would print). */
async function engineMessage(bytes: Uint8Array, options: Parameters<typeof analyzeCapture>[1]): Promise<string> {
  try {
    await analyzeCapture({ chunks: [bytes], totalBytes: bytes.length }, options);
  } catch (e) {
    return (e as Error).message;
  }
  throw new Error('the engine accepted the input');
}

let app: Express;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let otherBenchId: string;
const iq = iqCapture(20_000, 100_000, 100, 7);

beforeAll(async () => {
  app = captureApp();
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Capture bench');
  otherBenchId = await createBench(outsider, 'Somebody else’s bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
});

afterAll(async () => {
  await closeTestDb();
});

describe('POST /api/benches/:benchId/captures', () => {
  it('stores the file streamed with its sha256 and answers 201 { capture, analysis } with the analysis queued', async () => {
    const res = await upload(analyst.agent, benchId, iq, 'kestrel-run1.f32', {
      ...IQ_FIELDS,
      setup: 'heterodyne',
      setupParams: '{"referenceLinewidthHz": 120}',
      driveCurrentMa: '180.5',
      temperatureC: '25',
      outputPowerMw: '12',
      notes: 'first light',
      tags: 'quiet, ecl',
      segment: '4096',
      window: 'blackman-harris',
    });
    expect(res.status).toBe(201);
    const { capture, analysis } = res.body;
    expect(capture).toMatchObject({
      benchId,
      uploadedBy: analyst.user.id,
      fileName: 'kestrel-run1.f32',
      sizeBytes: iq.length,
      sha256: createHash('sha256').update(iq).digest('hex'),
      format: 'raw',
      kind: 'iq',
      sampleRateHz: 100000,
      dtype: 'float32',
      channels: 2,
      byteOrder: 'little',
      setup: 'heterodyne',
      setupParams: { referenceLinewidthHz: 120 },
      driveCurrentMa: 180.5,
      temperatureC: 25,
      outputPowerMw: 12,
      notes: 'first light',
      tags: ['quiet', 'ecl'],
      duplicateOf: null,
    });
    expect(res.body.duplicateOf).toBeUndefined();
    expect(analysis).toMatchObject({ captureId: capture.id, status: 'queued', progress: 0, settings: { segment: 4096, window: 'blackman-harris' } });
    expect(storedFiles()).toContain(`captures/${benchId}/${capture.id}`);
    expect(storedFiles().filter((f) => f.startsWith('tmp/'))).toEqual([]);
  });

  it('flags the same bytes on the same bench as a duplicate of the earlier capture, and stores them all the same', async () => {
    const bytes = iqCapture(20_000, 100_000, 50, 99);
    const first = await upload(owner.agent, benchId, bytes, 'a.f32');
    const again = await upload(analyst.agent, benchId, bytes, 'b.f32');
    expect(first.status).toBe(201);
    expect(again.status).toBe(201);
    expect(again.body.duplicateOf).toBe(first.body.capture.id);
    expect(again.body.capture.duplicateOf).toBe(first.body.capture.id);
    expect(storedFiles()).toContain(`captures/${benchId}/${again.body.capture.id}`);
    // on another bench the same bytes are no duplicate
    const elsewhere = await upload(outsider.agent, otherBenchId, bytes, 'c.f32');
    expect(elsewhere.status).toBe(201);
    expect(elsewhere.body.duplicateOf).toBeUndefined();
  });

  it('takes format, sample rate and kind from a CSV with a time column when the form leaves them out', async () => {
    const rows = ['time,phase'];
    for (let i = 0; i < 3000; i++) rows.push(`${(i * 1e-4).toFixed(4)},${Math.sin(i / 50).toFixed(6)}`);
    const res = await upload(analyst.agent, benchId, Buffer.from(rows.join('\n') + '\n'), 'wren-phase.csv', {});
    expect(res.status).toBe(201);
    expect(res.body.capture).toMatchObject({ format: 'csv', kind: 'phase', sampleRateHz: 10000, dtype: null, byteOrder: null });
  });

  it('takes each demo sample in samples/ with only what its README says the file cannot tell', async () => {
    const samples: [string, Record<string, string>, Record<string, unknown>][] = [
      ['kestrel-ecl-1550-iq.npy', { sampleRateHz: '250000' }, { format: 'npy', kind: 'iq', sampleRateHz: 250000 }],
      ['kestrel-ecl-1550-phase.csv', {}, { format: 'csv', kind: 'phase', sampleRateHz: 100000 }],
      ['wren-dfb-1549-iq-int16.bin', { dtype: 'int16', channels: '2', sampleRateHz: '500000' }, { format: 'raw', kind: 'iq', dtype: 'int16', channels: 2 }],
      ['heron-fl-1560-beat.wav', { kind: 'beat' }, { format: 'wav', kind: 'beat', sampleRateHz: 192000 }],
    ];
    for (const [file, fields, expected] of samples) {
      const bytes = readFileSync(path.join(projectRoot, 'samples', file));
      const res = await upload(analyst.agent, benchId, bytes, file, fields);
      expect(res.status, `${file}: ${res.text}`).toBe(201);
      expect(res.body.capture).toMatchObject({ fileName: file, sizeBytes: bytes.length, ...expected });
    }
  });

  it('refuses a viewer with 403, a non-member with 404 and nobody with 401, storing nothing', async () => {
    const before = { files: storedFiles(), rows: await rowCounts(benchId) };
    const v = await upload(viewer.agent, benchId, iq, 'v.f32');
    expect(v.status).toBe(403);
    expect(errorOf(v).code).toBe('forbidden');
    const o = await upload(outsider.agent, benchId, iq, 'o.f32');
    expect(o.status).toBe(404);
    expect(errorOf(o).code).toBe('not_found');
    const anon = await upload(agent(app), benchId, iq, 'anon.f32');
    expect(anon.status).toBe(401);
    expect(storedFiles()).toEqual(before.files);
    expect(await rowCounts(benchId)).toEqual(before.rows);
  });

  it('answers 400 validation_failed naming each bad form field, and removes the received file', async () => {
    const before = { files: storedFiles(), rows: await rowCounts(benchId) };
    const res = await upload(analyst.agent, benchId, iq, 'x.f32', {
      ...IQ_FIELDS,
      sampleRateHz: 'fast',
      channels: '3',
      setupParams: '{not json',
      floorBandHz: '5e4:1e3',
    });
    expect(res.status).toBe(400);
    const err = errorOf(res);
    expect(err.code).toBe('validation_failed');
    expect(err.details?.map((d) => d.path).sort()).toEqual(['channels', 'floorBandHz', 'sampleRateHz', 'setupParams']);
    expect(storedFiles()).toEqual(before.files);
    expect(await rowCounts(benchId)).toEqual(before.rows);
  });

  it('answers 400 when the form has no file', async () => {
    const res = await analyst.agent.post(`/api/benches/${benchId}/captures`).field('kind', 'iq');
    expect(res.status).toBe(400);
    expect(errorOf(res).details?.[0].path).toBe('file');
  });

  it('answers 400 validation_failed for a laser that is not on this bench', async () => {
    const laser = await outsider.agent.post(`/api/benches/${otherBenchId}/lasers`).send({ name: 'Foreign DFB', type: 'dfb' });
    expect(laser.status).toBe(201);
    const before = storedFiles();
    const res = await upload(analyst.agent, benchId, iq, 'x.f32', { ...IQ_FIELDS, laserId: laser.body.laser.id });
    expect(res.status).toBe(400);
    expect(errorOf(res).details?.[0]).toEqual({ path: 'laserId', message: 'no such laser on this bench' });
    expect(storedFiles()).toEqual(before);
  });

  describe('bad input is answered 400 with the engine’s message, leaving no file and no row', () => {
    const cases: { name: string; bytes: Uint8Array; fileName: string; fields: Record<string, string>; engine: Parameters<typeof analyzeCapture>[1] }[] = [
      {
        name: 'unknown format',
        bytes: Uint8Array.from({ length: 2048 }, (_, i) => (i * 37 + 11) & 0xff),
        fileName: 'mystery.xyz',
        fields: { kind: 'iq', sampleRateHz: '1000' },
        engine: { kind: 'iq', sampleRateHz: 1000, fileName: 'mystery.xyz' },
      },
      {
        name: 'missing sample rate (raw)',
        bytes: iq,
        fileName: 'no-rate.f32',
        fields: { kind: 'iq', format: 'raw', dtype: 'float32', channels: '2' },
        engine: { kind: 'iq', format: 'raw', dtype: 'float32', channels: 2 },
      },
      {
        name: 'raw without its dtype',
        bytes: iq,
        fileName: 'no-dtype.bin',
        fields: { kind: 'iq', sampleRateHz: '1000', format: 'raw' },
        engine: { kind: 'iq', sampleRateHz: 1000, format: 'raw' },
      },
      {
        name: 'corrupt NumPy header',
        bytes: Buffer.concat([Buffer.from([0x93]), Buffer.from('NUMPY'), Buffer.from([1, 0, 20, 0]), Buffer.from("{'descr': '<f4', 'fo"), Buffer.alloc(64)]),
        fileName: 'broken.npy',
        fields: { kind: 'phase', sampleRateHz: '1000' },
        engine: { kind: 'phase', sampleRateHz: 1000, fileName: 'broken.npy' },
      },
      {
        name: 'a CSV cell that is not a number',
        bytes: Buffer.from('phase\n0.1\n0.2\nabc\n0.4\n'),
        fileName: 'bad-cell.csv',
        fields: { kind: 'phase', sampleRateHz: '1000' },
        engine: { kind: 'phase', sampleRateHz: 1000, fileName: 'bad-cell.csv' },
      },
      {
        name: 'kind iq for a one-channel file',
        bytes: Buffer.from('phase\n0.1\n0.2\n0.3\n'),
        fileName: 'one-channel.csv',
        fields: { kind: 'iq', sampleRateHz: '1000' },
        engine: { kind: 'iq', sampleRateHz: 1000, fileName: 'one-channel.csv' },
      },
    ];

    for (const c of cases) {
      it(c.name, async () => {
        const expected = await engineMessage(c.bytes, c.engine);
        const before = { files: storedFiles(), rows: await rowCounts(benchId) };
        const res = await upload(analyst.agent, benchId, Buffer.from(c.bytes), c.fileName, c.fields);
        expect(res.status).toBe(400);
        expect(errorOf(res)).toEqual({ code: 'bad_input', message: expected });
        expect(storedFiles()).toEqual(before.files);
        expect(await rowCounts(benchId)).toEqual(before.rows);
      });
    }
  });

  it('answers 413 over PHASELOOM_MAX_UPLOAD_BYTES with the limit in the message, and removes the partial file', async () => {
    const small = captureApp({ env: { PHASELOOM_MAX_UPLOAD_BYTES: 1024 } });
    const a = agent(small);
    await a.post('/api/auth/sign-in').send({ email: analyst.user.email, password: 'correct horse battery staple' }).expect(200);
    const before = { files: storedFiles(), rows: await rowCounts(benchId) };
    const res = await upload(a, benchId, iq.subarray(0, 64 * 1024), 'big.f32');
    expect(res.status).toBe(413);
    expect(errorOf(res)).toEqual({ code: 'payload_too_large', message: 'the file is larger than the 1 KiB upload limit' });
    expect(storedFiles()).toEqual(before.files);
    expect(await rowCounts(benchId)).toEqual(before.rows);
    // at the limit exactly it is accepted
    const fits = await upload(a, benchId, iq.subarray(0, 1024), 'fits.f32');
    expect(fits.status).not.toBe(413);
  });

  it('rolls the rows back and removes the file when moving it into place fails', async () => {
    const disk = new LocalDiskStorage(storageDir);
    const failing: Storage = {
      config: disk.config,
      put: (k, s) => disk.put(k, s),
      open: (k, o) => disk.open(k, o),
      stat: (k) => disk.stat(k),
      delete: (k) => disk.delete(k),
      move: async () => {
        throw new Error('disk full');
      },
    };
    const broken = captureApp({ storage: failing });
    const a = agent(broken);
    await a.post('/api/auth/sign-in').send({ email: analyst.user.email, password: 'correct horse battery staple' }).expect(200);
    const before = { files: storedFiles(), rows: await rowCounts(benchId) };
    const res = await upload(a, benchId, iq, 'doomed.f32');
    expect(res.status).toBe(500);
    expect(storedFiles()).toEqual(before.files);
    expect(await rowCounts(benchId)).toEqual(before.rows);
  });
});

describe('uploadDemoCaptures (the demo seed’s path)', () => {
  it('uploads each demo sample once through the captures service, with its laser and operating point', async () => {
    const db = testDb();
    const services = createServices(db);
    const demoBench = await createBench(owner, 'Demo-like bench');
    const access = await services.benches.resolveAccess(owner.user.id, demoBench);
    const laserIds: Record<string, string> = {};
    for (const name of ['Kestrel ECL-1550', 'Wren DFB-1549', 'Heron FL-1560']) {
      laserIds[name] = (await services.lasers.create(access, { name, type: 'other' })).id;
    }
    const captures = createCapturesService({ db, storage: new LocalDiskStorage(storageDir), lasers: services.lasers });
    expect(await uploadDemoCaptures({ captures, access, laserIds })).toBe(DEMO_CAPTURES.length);
    expect(await uploadDemoCaptures({ captures, access, laserIds })).toBe(0);
    const list = await owner.agent.get(`/api/benches/${demoBench}/captures?laserId=${laserIds['Wren DFB-1549']}`);
    expect(list.body.captures).toHaveLength(1);
    expect(list.body.captures[0]).toMatchObject({ fileName: 'wren-dfb-1549-iq-int16.bin', driveCurrentMa: 120, uploadedBy: owner.user.id });
    expect(list.body.captures[0].latestAnalysis.status).toBe('queued');
  });
});

describe('GET /api/benches/:benchId/captures', () => {
  let listBench: string;
  let laserId: string;

  beforeAll(async () => {
    listBench = await createBench(owner, 'List bench');
    await addMember(owner, listBench, viewer, 'viewer');
    const laser = await owner.agent.post(`/api/benches/${listBench}/lasers`).send({ name: 'Heron FL-1560', type: 'fibre' });
    laserId = laser.body.laser.id;
    for (let i = 0; i < 5; i++) {
      const fields: Record<string, string> = { ...IQ_FIELDS, tags: i % 2 ? 'odd' : 'even' };
      if (i < 2) fields.laserId = laserId;
      const res = await upload(owner.agent, listBench, iqCapture(20_000, 100_000, 10, 100 + i), `run-${i}.f32`, fields);
      expect(res.status).toBe(201);
    }
    const csv = await upload(owner.agent, listBench, Buffer.from('phase\n' + '0.1\n'.repeat(500)), 'flat.csv', { kind: 'phase', sampleRateHz: '100' });
    expect(csv.status).toBe(201);
  });

  it('lists newest first with the latest analysis of each, paginated with a total', async () => {
    const res = await viewer.agent.get(`/api/benches/${listBench}/captures?page=1&pageSize=4`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ page: 1, pageSize: 4, total: 6 });
    expect(res.body.captures.map((c: { fileName: string }) => c.fileName)).toEqual(['flat.csv', 'run-4.f32', 'run-3.f32', 'run-2.f32']);
    expect(res.body.captures[0].latestAnalysis).toMatchObject({ status: 'queued', progress: 0, intrinsicLinewidthHz: null });
    const page2 = await viewer.agent.get(`/api/benches/${listBench}/captures?page=2&pageSize=4`);
    expect(page2.body.captures.map((c: { fileName: string }) => c.fileName)).toEqual(['run-1.f32', 'run-0.f32']);
  });

  it('filters by laser, kind and tag', async () => {
    const byLaser = await viewer.agent.get(`/api/benches/${listBench}/captures?laserId=${laserId}`);
    expect(byLaser.body.total).toBe(2);
    const byKind = await viewer.agent.get(`/api/benches/${listBench}/captures?kind=phase`);
    expect(byKind.body.captures.map((c: { fileName: string }) => c.fileName)).toEqual(['flat.csv']);
    const byTag = await viewer.agent.get(`/api/benches/${listBench}/captures?tag=odd`);
    expect(byTag.body.captures.map((c: { fileName: string }) => c.fileName)).toEqual(['run-3.f32', 'run-1.f32']);
  });

  it('answers 400 for a bad filter and 404 to a non-member', async () => {
    expect((await viewer.agent.get(`/api/benches/${listBench}/captures?kind=laser`)).status).toBe(400);
    expect((await viewer.agent.get(`/api/benches/${listBench}/captures?pageSize=1000`)).status).toBe(400);
    expect((await outsider.agent.get(`/api/benches/${listBench}/captures`)).status).toBe(404);
  });
});

describe('GET and DELETE /api/captures/:id', () => {
  async function newCapture(by: SignedIn, seed: number): Promise<string> {
    const res = await upload(by.agent, benchId, iqCapture(20_000, 100_000, 10, seed), `d-${seed}.f32`);
    expect(res.status).toBe(201);
    return res.body.capture.id;
  }

  it('reads a capture with its analyses for every member; 404 for a member of another bench and for unknown ids', async () => {
    const id = await newCapture(analyst, 501);
    for (const who of [owner, analyst, viewer]) {
      const res = await who.agent.get(`/api/captures/${id}`);
      expect(res.status).toBe(200);
      expect(res.body.capture.id).toBe(id);
      expect(res.body.analyses).toHaveLength(1);
      expect(res.body.analyses[0]).toMatchObject({ captureId: id, status: 'queued' });
    }
    const outside = await outsider.agent.get(`/api/captures/${id}`);
    expect(outside.status).toBe(404);
    expect((await outsider.agent.delete(`/api/captures/${id}`)).status).toBe(404);
    expect((await owner.agent.get('/api/captures/aaaaaaaaaaaaaaaaaaaaaaaa')).status).toBe(404);
    expect((await owner.agent.get('/api/captures/not-an-id')).status).toBe(404);
    expect((await agent(app).get(`/api/captures/${id}`)).status).toBe(401);
  });

  it('lets the uploading analyst and an owner delete — file and rows together — and refuses viewers and other analysts', async () => {
    const mine = await newCapture(analyst, 601);
    const owners = await newCapture(owner, 602);
    expect((await viewer.agent.delete(`/api/captures/${mine}`)).status).toBe(403);
    const notYours = await analyst.agent.delete(`/api/captures/${owners}`);
    expect(notYours.status).toBe(403);
    expect(errorOf(notYours).code).toBe('forbidden');

    expect((await analyst.agent.delete(`/api/captures/${mine}`)).status).toBe(204);
    expect((await owner.agent.delete(`/api/captures/${owners}`)).status).toBe(204);
    for (const id of [mine, owners]) {
      expect(storedFiles()).not.toContain(`captures/${benchId}/${id}`);
      expect(await testDb()('captures').where({ id }).first()).toBeUndefined();
      expect(await testDb()('analyses').where({ capture_id: id }).first()).toBeUndefined();
      expect((await owner.agent.get(`/api/captures/${id}`)).status).toBe(404);
    }
  });
});
