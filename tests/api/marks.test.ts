/**
 * Mark routes across roles: GET/POST /api/captures/:captureId/marks, PATCH/DELETE /api/marks/:id —
 * owners and analysts add, authors (or owners) edit and delete, viewers read (403 on writes),
 * members of other benches 404 on every id; frequencies outside the spectrum's band, lo ≥ hi and
 * empty text are 400 with nothing changed; marks belong to the capture and survive re-analysis.
 * The analysis is marked done in the database with a known display series (no job runner here):
 * lowest frequency 0.5 Hz, sample rate 100 kHz, so the band is 0.5 Hz … 50 kHz (Nyquist = fs/2).
 */
import { readFileSync } from 'node:fs';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  addMember,
  agent,
  closeTestDb,
  createBench,
  errorOf,
  makeTestApp,
  signUp,
  type Agent,
  type SignedIn,
} from '../helpers/api-app';

const FS = 100_000;

/** Interleaved float32 I,Q of a clean tone: a valid capture the upload accepts. */
function iqTone(samples: number): Buffer {
  const out = new Float32Array(2 * samples);
  for (let i = 0; i < samples; i++) {
    out[2 * i] = Math.cos(0.01 * i);
    out[2 * i + 1] = Math.sin(0.01 * i);
  }
  return Buffer.from(out.buffer);
}

function upload(a: Agent, benchId: string, name: string) {
  const fields = { kind: 'iq', sampleRateHz: String(FS), format: 'raw', dtype: 'float32', channels: '2' };
  let req = a.post(`/api/benches/${benchId}/captures`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', iqTone(4096), name);
}

/** What the job runner writes when an analysis is done, with a known display series. */
async function markDone(db: Knex, analysisId: string, lowestHz = 0.5): Promise<void> {
  await db('analyses')
    .where({ id: analysisId })
    .update({
      status: 'done',
      progress: 1,
      stage: 'done',
      display_series: JSON.stringify({ frequencyHz: [lowestHz, 10, 1000, 45_000], frequencyNoiseHz2PerHz: [1e4, 1e3, 1e2, 1e2] }),
      result: JSON.stringify({ input: { kind: 'iq', format: 'raw', samples: 4096, sampleRateHz: FS, durationS: 4096 / FS } }),
      finished_at: new Date(),
    });
}

let app: Express;
let db: Knex;
let owner: SignedIn;
let analyst: SignedIn;
let analyst2: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let captureId: string;
let analysisId: string;

const marksOf = (id = captureId) => `/api/captures/${id}/marks`;
const countMarks = async () => Number(((await db('marks').where({ capture_id: captureId }).count({ n: '*' })) as { n: number }[])[0].n);

beforeAll(async () => {
  ({ app, db } = makeTestApp());
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  analyst2 = await signUp(app, 'analyst2');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Marks bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, analyst2, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  await createBench(outsider, 'Another bench');
  const res = await upload(analyst.agent, benchId, 'wren-dfb.f32');
  expect(res.status).toBe(201);
  captureId = res.body.capture.id;
  analysisId = res.body.analysis.id;
}, 60_000);

afterAll(async () => {
  await closeTestDb();
});

describe('POST /api/captures/:captureId/marks before any analysis is done', () => {
  it('answers 409 conflict (no frequency axis to pin to yet) and stores nothing', async () => {
    const res = await analyst.agent.post(marksOf()).send({ kind: 'mains', text: '50 Hz mains', frequencyHz: 50 });
    expect(res.status).toBe(409);
    expect(errorOf(res).message).toMatch(/no finished spectrum/);
    expect(await countMarks()).toBe(0);
  });

  it('GET lists no marks and a null band', async () => {
    const res = await viewer.agent.get(marksOf());
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ marks: [], bandHz: null });
  });
});

describe('marks on a done spectrum', () => {
  let analystMarkId: string;
  let ownerMarkId: string;

  beforeAll(async () => {
    await markDone(db, analysisId);
  });

  it('GET /api/captures/:captureId/marks gives the band from the lowest frequency to Nyquist (fs/2)', async () => {
    const res = await viewer.agent.get(marksOf());
    expect(res.status).toBe(200);
    expect(res.body.bandHz).toEqual([0.5, FS / 2]);
  });

  it('POST as an analyst adds a mark at one frequency (201, author and canEdit)', async () => {
    const res = await analyst.agent.post(marksOf()).send({ kind: 'mains', text: '  50 Hz mains  ', frequencyHz: 50 });
    expect(res.status).toBe(201);
    expect(res.body.mark).toMatchObject({
      captureId,
      kind: 'mains',
      text: '50 Hz mains',
      frequencyHz: 50,
      bandHz: null,
      authorId: analyst.user.id,
      authorName: 'analyst',
      canEdit: true,
    });
    analystMarkId = res.body.mark.id;
  });

  it('POST as an owner adds a band mark [lo, hi]', async () => {
    const res = await owner.agent.post(marksOf()).send({ kind: 'servo-bump', text: 'servo bump', bandHz: [20_000, 30_000] });
    expect(res.status).toBe(201);
    expect(res.body.mark).toMatchObject({ kind: 'servo-bump', frequencyHz: null, bandHz: [20_000, 30_000], authorId: owner.user.id });
    ownerMarkId = res.body.mark.id;
  });

  it('accepts the band edges themselves (lowest frequency and Nyquist)', async () => {
    const res = await owner.agent.post(marksOf()).send({ kind: 'other', text: 'whole band', bandHz: [0.5, FS / 2] });
    expect(res.status).toBe(201);
    expect((await owner.agent.delete(`/api/marks/${res.body.mark.id}`)).status).toBe(204);
  });

  it('GET lists marks lowest frequency first, with canEdit for the caller (author or owner)', async () => {
    const asAnalyst2 = await analyst2.agent.get(marksOf());
    expect(asAnalyst2.status).toBe(200);
    expect(asAnalyst2.body.marks.map((m: { id: string }) => m.id)).toEqual([analystMarkId, ownerMarkId]);
    expect(asAnalyst2.body.marks.map((m: { canEdit: boolean }) => m.canEdit)).toEqual([false, false]);
    const asOwner = await owner.agent.get(marksOf());
    expect(asOwner.body.marks.map((m: { canEdit: boolean }) => m.canEdit)).toEqual([true, true]);
    const asViewer = await viewer.agent.get(marksOf());
    expect(asViewer.body.marks.map((m: { canEdit: boolean }) => m.canEdit)).toEqual([false, false]);
  });

  it('POST as a viewer answers 403 forbidden and stores nothing', async () => {
    const before = await countMarks();
    const res = await viewer.agent.post(marksOf()).send({ kind: 'spur', text: 'a spur', frequencyHz: 100 });
    expect(res.status).toBe(403);
    expect(errorOf(res).code).toBe('forbidden');
    expect(await countMarks()).toBe(before);
  });

  it('a viewer is refused before the body is looked at (403 even for a bad body)', async () => {
    const res = await viewer.agent.post(marksOf()).send({ kind: 'nonsense' });
    expect(res.status).toBe(403);
  });

  it('GET and POST as a member of another bench answer 404 not_found', async () => {
    expect((await outsider.agent.get(marksOf())).status).toBe(404);
    const res = await outsider.agent.post(marksOf()).send({ kind: 'spur', text: 'x', frequencyHz: 100 });
    expect(res.status).toBe(404);
    expect(errorOf(res).code).toBe('not_found');
  });

  it('an unknown or malformed capture id answers 404', async () => {
    expect((await owner.agent.get(marksOf('aaaaaaaaaaaaaaaaaaaaaaaa'))).status).toBe(404);
    expect((await owner.agent.get(marksOf('not-an-id'))).status).toBe(404);
  });

  it('without a session every mark route answers 401', async () => {
    const anon = agent(app);
    expect((await anon.get(marksOf())).status).toBe(401);
    expect((await anon.patch(`/api/marks/${analystMarkId}`).send({ text: 'x' })).status).toBe(401);
  });

  describe('bad input answers 400 and stores nothing', () => {
    const cases: [string, Record<string, unknown>, string, RegExp][] = [
      ['a frequency above Nyquist', { kind: 'spur', text: 'too high', frequencyHz: 60_000 }, 'frequencyHz', /above this spectrum's band, 500 mHz to 50 kHz/],
      ['a frequency below the lowest frequency', { kind: 'spur', text: 'too low', frequencyHz: 0.1 }, 'frequencyHz', /below this spectrum's band, 500 mHz to 50 kHz/],
      ['a band running past Nyquist', { kind: 'other', text: 'wide', bandHz: [1000, 80_000] }, 'bandHz.1', /above this spectrum's band/],
      ['a band starting below the lowest frequency', { kind: 'other', text: 'wide', bandHz: [0.01, 10] }, 'bandHz.0', /below this spectrum's band/],
      ['lo ≥ hi', { kind: 'other', text: 'backwards', bandHz: [300, 200] }, 'bandHz.1', /low edge must be below the high edge/],
      ['lo = hi', { kind: 'other', text: 'empty band', bandHz: [300, 300] }, 'bandHz.1', /low edge must be below the high edge/],
      ['empty text', { kind: 'spur', text: '   ', frequencyHz: 100 }, 'text', /must not be empty/],
      ['an unknown kind', { kind: 'laser-blip', text: 'x', frequencyHz: 100 }, 'kind', /./],
      ['neither frequency nor band', { kind: 'spur', text: 'where?' }, 'frequencyHz', /give frequencyHz/],
      ['both frequency and band', { kind: 'spur', text: 'both', frequencyHz: 100, bandHz: [10, 20] }, 'bandHz', /not both/],
      ['a negative frequency', { kind: 'spur', text: 'x', frequencyHz: -5 }, 'frequencyHz', /positive/],
      ['an unknown field', { kind: 'spur', text: 'x', frequencyHz: 100, colour: 'red' }, '', /./],
    ];
    for (const [name, body, path, message] of cases) {
      it(`POST with ${name} → 400 naming ${path || 'the body'}`, async () => {
        const before = await countMarks();
        const res = await analyst.agent.post(marksOf()).send(body);
        expect(res.status).toBe(400);
        const error = errorOf(res);
        expect(error.code).toBe('validation_failed');
        const detail = error.details?.find((d) => d.path === path);
        expect(detail, JSON.stringify(error)).toBeDefined();
        expect(detail!.message).toMatch(message);
        if (path.startsWith('frequencyHz') || path.startsWith('bandHz')) expect(error.message).toContain(path.split('.')[0]);
        expect(await countMarks()).toBe(before);
      });
    }
  });

  describe('PATCH /api/marks/:id', () => {
    it('the author (an analyst) edits their own mark', async () => {
      const res = await analyst.agent.patch(`/api/marks/${analystMarkId}`).send({ text: '50 Hz mains, ground loop', kind: 'mains' });
      expect(res.status).toBe(200);
      expect(res.body.mark).toMatchObject({ id: analystMarkId, text: '50 Hz mains, ground loop', frequencyHz: 50 });
      expect(Date.parse(res.body.mark.updatedAt)).toBeGreaterThanOrEqual(Date.parse(res.body.mark.createdAt));
    });

    it('an owner edits any mark, and turning a frequency into a band works', async () => {
      const res = await owner.agent.patch(`/api/marks/${analystMarkId}`).send({ bandHz: [45, 55] });
      expect(res.status).toBe(200);
      expect(res.body.mark).toMatchObject({ frequencyHz: null, bandHz: [45, 55], authorId: analyst.user.id });
      const back = await owner.agent.patch(`/api/marks/${analystMarkId}`).send({ frequencyHz: 50 });
      expect(back.body.mark).toMatchObject({ frequencyHz: 50, bandHz: null });
    });

    it('another analyst answers 403 and changes nothing', async () => {
      const res = await analyst2.agent.patch(`/api/marks/${analystMarkId}`).send({ text: 'mine now' });
      expect(res.status).toBe(403);
      expect(errorOf(res).message).toMatch(/only the marks they wrote/);
      expect((await db('marks').where({ id: analystMarkId }).first()).text).toBe('50 Hz mains, ground loop');
    });

    it('an analyst cannot edit an owner’s mark (403)', async () => {
      expect((await analyst.agent.patch(`/api/marks/${ownerMarkId}`).send({ text: 'x' })).status).toBe(403);
    });

    it('a viewer answers 403; a member of another bench 404', async () => {
      expect((await viewer.agent.patch(`/api/marks/${analystMarkId}`).send({ text: 'x' })).status).toBe(403);
      const res = await outsider.agent.patch(`/api/marks/${analystMarkId}`).send({ text: 'x' });
      expect(res.status).toBe(404);
      expect(errorOf(res).code).toBe('not_found');
    });

    it('a frequency moved outside the band → 400 naming frequencyHz and the band, mark unchanged', async () => {
      const res = await analyst.agent.patch(`/api/marks/${analystMarkId}`).send({ frequencyHz: 75_000 });
      expect(res.status).toBe(400);
      expect(errorOf(res).message).toMatch(/^frequencyHz: 75 kHz is above this spectrum's band, 500 mHz to 50 kHz/);
      expect((await db('marks').where({ id: analystMarkId }).first()).lo_hz).toBe(50);
    });

    it('empty text, lo ≥ hi and an empty body → 400', async () => {
      expect((await analyst.agent.patch(`/api/marks/${analystMarkId}`).send({ text: '' })).status).toBe(400);
      expect((await analyst.agent.patch(`/api/marks/${analystMarkId}`).send({ bandHz: [60, 40] })).status).toBe(400);
      expect((await analyst.agent.patch(`/api/marks/${analystMarkId}`).send({})).status).toBe(400);
    });

    it('an unknown mark id answers 404', async () => {
      expect((await owner.agent.patch('/api/marks/aaaaaaaaaaaaaaaaaaaaaaaa').send({ text: 'x' })).status).toBe(404);
    });
  });

  describe('re-analysis', () => {
    it('marks belong to the capture: a new analysis of it lists the same marks', async () => {
      const res = await analyst.agent.post(`/api/captures/${captureId}/analyses`).send({ settings: { segment: 1024 } });
      expect(res.status).toBe(201);
      await markDone(db, res.body.analysis.id, 2);
      const list = await viewer.agent.get(marksOf());
      expect(list.body.marks.map((m: { id: string }) => m.id)).toEqual([analystMarkId, ownerMarkId]);
      // the band now follows the latest done analysis (lowest frequency 2 Hz)
      expect(list.body.bandHz).toEqual([2, FS / 2]);
    });
  });

  describe('DELETE /api/marks/:id', () => {
    it('another analyst and a viewer answer 403; a member of another bench 404; nothing is deleted', async () => {
      expect((await analyst2.agent.delete(`/api/marks/${analystMarkId}`)).status).toBe(403);
      expect((await viewer.agent.delete(`/api/marks/${analystMarkId}`)).status).toBe(403);
      expect((await outsider.agent.delete(`/api/marks/${analystMarkId}`)).status).toBe(404);
      expect(await countMarks()).toBe(2);
    });

    it('the author deletes their own mark (204), then it is gone (404)', async () => {
      expect((await analyst.agent.delete(`/api/marks/${analystMarkId}`)).status).toBe(204);
      expect((await analyst.agent.delete(`/api/marks/${analystMarkId}`)).status).toBe(404);
    });

    it('an owner deletes anyone’s mark', async () => {
      const added = await analyst2.agent.post(marksOf()).send({ kind: 'relaxation-oscillation', text: 'RO peak', frequencyHz: 30_000 });
      expect(added.status).toBe(201);
      expect((await owner.agent.delete(`/api/marks/${added.body.mark.id}`)).status).toBe(204);
      expect((await owner.agent.delete(`/api/marks/${ownerMarkId}`)).status).toBe(204);
      expect(await countMarks()).toBe(0);
    });
  });
});

describe('GET /api/version', () => {
  it('answers the name and version of package.json, without a session', async () => {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { name: string; version: string };
    const res = await agent(app).get('/api/version');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ name: pkg.name, version: pkg.version });
  });
});
