// The opt-in "analysis finished" notice: settings per person (GET/PUT /api/notification-settings),
// and the job runner's completion sending the e-mail, through nodemailer, to the real mail catcher —
// only to people who turned it on.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/config/env';
import type { AnalysisExecutor, AnalysisTask } from '../../server/jobs/analysis-task';
import { JobRunner } from '../../server/jobs/runner';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { createSmtpMailer } from '../../server/mail/mailer';
import { createNotificationsService } from '../../server/mail/notifications/notifications.service';
import { listCaughtMessages } from '../../server/mail/outbox-store';
import { LocalDiskStorage } from '../../server/storage/local-disk-storage';
import { addMember, agent, closeTestDb, createBench, errorOf, makeTestApp, PUBLIC_URL, signUp, type SignedIn } from '../helpers/api-app';

let catcher: MailCatcher;
let dir: string;
let app: Express;
let db: ReturnType<typeof makeTestApp>['db'];
let owner: SignedIn;
let analyst: SignedIn;
let benchId: string;

function iqBytes(n = 2048): Buffer {
  const out = new Float32Array(2 * n);
  for (let i = 0; i < n; i++) {
    out[2 * i] = Math.cos(0.02 * i);
    out[2 * i + 1] = Math.sin(0.02 * i);
  }
  return Buffer.from(out.buffer);
}

async function uploadAs(who: SignedIn, name: string): Promise<string> {
  const res = await who.agent
    .post(`/api/benches/${benchId}/captures`)
    .field('kind', 'iq')
    .field('sampleRateHz', '100000')
    .field('format', 'raw')
    .field('dtype', 'float32')
    .field('channels', '2')
    .attach('file', iqBytes(), name);
  expect(res.status).toBe(201);
  return res.body.analysis.id;
}

beforeAll(async () => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-outbox-'));
  catcher = await startMailCatcher({ port: 0, dir });
  ({ app, db } = makeTestApp({ env: { PHASELOOM_SMTP_PORT: catcher.port, PHASELOOM_OUTBOX_DIR: dir } }));
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  benchId = await createBench(owner, 'Notice bench');
  await addMember(owner, benchId, analyst, 'analyst');
});

afterAll(async () => {
  await catcher.close();
  rmSync(dir, { recursive: true, force: true });
  await closeTestDb();
});

describe('/api/notification-settings', () => {
  it('is off until turned on, per person', async () => {
    expect((await owner.agent.get('/api/notification-settings')).body).toEqual({ settings: { analysisFinished: false } });
    const on = await owner.agent.put('/api/notification-settings').send({ analysisFinished: true });
    expect(on.status).toBe(200);
    expect(on.body).toEqual({ settings: { analysisFinished: true } });
    expect((await owner.agent.get('/api/notification-settings')).body.settings.analysisFinished).toBe(true);
    expect((await analyst.agent.get('/api/notification-settings')).body.settings.analysisFinished).toBe(false);
  });

  it('needs a sign-in (401) and a boolean (400)', async () => {
    expect((await agent(app).get('/api/notification-settings')).status).toBe(401);
    expect((await agent(app).put('/api/notification-settings').send({ analysisFinished: true })).status).toBe(401);
    const bad = await owner.agent.put('/api/notification-settings').send({ analysisFinished: 'yes' });
    expect(bad.status).toBe(400);
    expect(errorOf(bad).details?.[0].path).toBe('analysisFinished');
  });
});

describe('the "analysis finished" notice', () => {
  it('is mailed when the runner records an analysis, to its starter only if they opted in', async () => {
    const mine = await uploadAs(owner, 'owner-run.f32');
    const theirs = await uploadAs(analyst, 'analyst-run.f32');
    const env = { ...loadEnv(), NODE_ENV: 'test' as const, PHASELOOM_SMTP_PORT: catcher.port };
    const notices = createNotificationsService({ db, mailer: createSmtpMailer(env), baseUrl: PUBLIC_URL });
    const sent: Promise<boolean>[] = [];
    const finished: string[] = [];
    const executor: AnalysisExecutor = {
      size: 2,
      async run(task: AnalysisTask) {
        return task.analysisId === theirs
          ? { ok: false, message: 'the record is too short for this segment length' }
          : {
              ok: true,
              result: { input: { kind: task.input.kind } },
              figures: { intrinsicLinewidthHz: 1, betaLinewidthHz: 2, lineshapeFwhmHz: 3, whiteFloorHz2PerHz: 1 / Math.PI },
              displaySeries: { frequencyHz: [1, 10], frequencyNoiseHz2PerHz: [2, 2] },
              seriesKey: null,
            };
      },
      async close() {},
    };
    const runner = new JobRunner({
      db,
      storage: new LocalDiskStorage(loadEnv().storageDir),
      executor,
      pollIntervalMs: 50,
      onFinished: (id) => {
        finished.push(id);
        sent.push(notices.analysisFinished(id));
      },
    });
    await runner.start();
    try {
      for (let i = 0; i < 200 && !(finished.includes(mine) && finished.includes(theirs)); i++) {
        await new Promise((r) => setTimeout(r, 50));
      }
    } finally {
      await runner.stop();
    }
    expect(finished).toEqual(expect.arrayContaining([mine, theirs]));
    await Promise.all(sent);
    const messages = await listCaughtMessages(dir);
    const toOwner = messages.filter((m) => m.recipients.includes(owner.user.email));
    expect(toOwner).toHaveLength(1);
    expect(toOwner[0].subject).toBe('Analysis of owner-run.f32 is ready');
    expect(toOwner[0].text).toContain(`${PUBLIC_URL}/benches/${benchId}/spectra/${mine}`);
    expect(messages.some((m) => m.recipients.includes(analyst.user.email))).toBe(false);

    // once the analyst opts in, a failed analysis is reported with its reason
    await analyst.agent.put('/api/notification-settings').send({ analysisFinished: true });
    expect(await notices.analysisFinished(theirs)).toBe(true);
    const [failed] = (await listCaughtMessages(dir)).filter((m) => m.recipients.includes(analyst.user.email));
    expect(failed.subject).toBe('Analysis of analyst-run.f32 failed');
    expect(failed.text).toContain('Reason: the record is too short for this segment length');
  });
});
