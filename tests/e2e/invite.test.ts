// Invitation by e-mail in a real browser against the real server, nodemailer and an SMTP catcher:
// the demo owner uploads a capture, marks its spectrum and invites a colleague from the members page; the colleague opens
// the link from /outbox, creates the account with the invited address, lands on the bench and sees
// its spectra with the owner's mark; the used link then shows a clear "can no longer be used" page.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { launchBrowser, projectRoot, screenshots, startE2eServer, type E2eBrowser, type E2eServer } from '../helpers/e2e-server';

const DEMO = {
  owner: { email: 'mira.kestner@example.org', password: 'larchmere-demo-2026' },
  bench: 'Larchmere narrow-linewidth bench',
};
const COLLEAGUE = {
  email: `colleague-${randomBytes(4).toString('hex')}@example.org`,
  name: 'Odile Marsh',
  password: 'heron fibre laser bump',
};
/** 65 536 IQ samples (float32 pairs) of a laser with white frequency noise, 100 kHz sampling. */
function whiteFrequencyNoiseIq(samples = 65_536, sampleRateHz = 100_000, h0 = 100): Buffer {
  let s = 0x2545f491;
  const uniform = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) + 0.5) / 4294967296;
  };
  const out = new Float32Array(2 * samples);
  const sigma = Math.sqrt((h0 * sampleRateHz) / 2);
  let phase = 0;
  for (let i = 0; i < samples; i++) {
    phase += (2 * Math.PI * sigma * Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform())) / sampleRateHz;
    out[2 * i] = Math.cos(phase);
    out[2 * i + 1] = Math.sin(phase);
  }
  return Buffer.from(out.buffer);
}

const MARK_TEXT = `servo bump seen by Mira ${randomBytes(3).toString('hex')}`;

let catcher: MailCatcher;
let outboxDir: string;
let server: E2eServer;
let browser: E2eBrowser;
let benchId = '';
let markedAnalysisId = '';
let invitationLink = '';
const consoleErrors: string[] = [];

const url = (p: string) => `${server.baseUrl}${p}`;

function testEnv(): NodeJS.ProcessEnv {
  const env = process.env;
  return {
    ...env,
    NODE_ENV: 'test',
    PHASELOOM_DB_PORT: env.PHASELOOM_DB_PORT ?? '3309',
    PHASELOOM_DB_DATADIR: env.PHASELOOM_DB_DATADIR ?? '.data/mariadb-test',
    PHASELOOM_DB_NAME: env.PHASELOOM_DB_NAME ?? 'phaseloom_test',
    PHASELOOM_STORAGE_DIR: env.PHASELOOM_STORAGE_DIR ?? '.data/storage-test',
    LOG_LEVEL: 'silent',
  };
}

function seedDemo(): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/seed-demo.ts'], { cwd: projectRoot, env: testEnv(), stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('error', reject);
    child.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`the demo seed failed:\n${out}`))));
  });
}

/** JSON from the API in the page (with the page's session cookie and Origin). */
async function apiInPage<T>(method: string, p: string, body?: unknown): Promise<{ status: number; body: T }> {
  return browser.page.evaluate(
    async ({ method, p, body }) => {
      const res = await fetch(p, {
        method,
        headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: res.status, body: res.status === 204 ? null : await res.json() };
    },
    { method, p, body },
  ) as Promise<{ status: number; body: T }>;
}

beforeAll(async () => {
  // our own catcher on a free port; the server the harness starts sends to it (PHASELOOM_SMTP_PORT)
  outboxDir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-e2e-outbox-'));
  catcher = await startMailCatcher({ port: 0, dir: outboxDir });
  process.env.PHASELOOM_SMTP_PORT = String(catcher.port);
  process.env.PHASELOOM_OUTBOX_DIR = outboxDir;
  server = await startE2eServer();
  await seedDemo();
  browser = await launchBrowser();
  browser.page.on('console', (m) => {
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) consoleErrors.push(m.text());
  });
  browser.page.on('pageerror', (e) => consoleErrors.push(e.message));
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await catcher?.close();
  rmSync(outboxDir, { recursive: true, force: true });
});

describe('inviting a colleague by e-mail, in chromium', () => {
  it('the demo owner signs in, uploads a capture and marks its finished spectrum', async () => {
    const { page } = browser;
    await page.goto(url('/sign-in'));
    await page.getByLabel('E-mail').fill(DEMO.owner.email);
    await page.getByLabel('Password').fill(DEMO.owner.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/benches$/);

    const benches = await apiInPage<{ benches: { id: string; name: string }[] }>('GET', '/api/benches');
    benchId = benches.body.benches.find((b) => b.name === DEMO.bench)?.id ?? '';
    expect(benchId).toMatch(/^[a-z2-7]{24}$/);

    // a capture of our own (the demo seed may have none), analysed by the server's job runner
    const upload = await browser.page.evaluate(
      async ({ benchId, b64 }) => {
        const bytes = Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
        const form = new FormData();
        for (const [k, v] of Object.entries({ kind: 'iq', sampleRateHz: '100000', format: 'raw', dtype: 'float32', channels: '2' })) form.append(k, v);
        form.append('file', new Blob([bytes]), 'invite-e2e-iq.f32');
        const res = await fetch(`/api/benches/${benchId}/captures`, { method: 'POST', body: form });
        return { status: res.status, body: await res.json() };
      },
      { benchId, b64: whiteFrequencyNoiseIq().toString('base64') },
    );
    expect(upload.status).toBe(201);
    const captureId: string = upload.body.capture.id;
    let capture: { id: string; latestAnalysis: { id: string; status: string } | null } | undefined;
    for (let i = 0; i < 200 && !capture; i++) {
      const res = await apiInPage<{ capture: { id: string }; analyses: { id: string; status: string }[] }>('GET', `/api/captures/${captureId}`);
      const done = res.body.analyses.find((a) => a.status === 'done');
      const failed = res.body.analyses.find((a) => a.status === 'failed');
      if (failed) throw new Error(`the analysis failed: ${JSON.stringify(failed)}`);
      if (done) capture = { id: captureId, latestAnalysis: done };
      else await new Promise((r) => setTimeout(r, 500));
    }
    expect(capture, 'the uploaded capture is analysed').toBeDefined();
    markedAnalysisId = capture!.latestAnalysis!.id;
    const mark = await apiInPage<{ mark: { id: string } }>('POST', `/api/captures/${capture!.id}/marks`, {
      kind: 'servo-bump',
      text: MARK_TEXT,
      bandHz: [1000, 2000],
    });
    expect(mark.status).toBe(201);
  });

  it('the owner invites the colleague as a viewer from the members page', async () => {
    const { page } = browser;
    await page.goto(url(`/benches/${benchId}/members`));
    const form = page.getByRole('form', { name: 'Invite by e-mail' });
    await form.getByLabel('Invitee e-mail').fill(COLLEAGUE.email);
    await form.getByLabel('Invitee role').selectOption('viewer');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${COLLEAGUE.email}.`).waitFor();
    await page.getByRole('table', { name: 'Invitations' }).getByRole('row', { name: new RegExp(COLLEAGUE.email) }).waitFor();
    await screenshots(page, 'invite-members');
    // signed out, as the colleague would be
    await page.evaluate(() => fetch('/api/auth/sign-out', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: '{}' }));
    await browser.context.clearCookies();
  });

  it('the colleague finds the e-mail in /outbox and follows its link', async () => {
    const { page } = browser;
    await page.goto(url('/outbox'));
    const message = page.getByRole('article', { name: `You are invited to the bench "${DEMO.bench}" on Phaseloom` }).first();
    await message.waitFor();
    expect(await message.innerText()).toContain(COLLEAGUE.email);
    await screenshots(page, 'invite-outbox');
    const link = message.getByRole('link', { name: /\/invitation\// });
    invitationLink = (await link.getAttribute('href')) ?? '';
    expect(invitationLink.startsWith(`${server.baseUrl}/invitation/`)).toBe(true);
    await link.click();
    await page.waitForURL(/\/invitation\//);
    await page.getByRole('heading', { name: 'Join a bench' }).waitFor();
    await page.getByText(DEMO.bench).first().waitFor();
  });

  it('signs up with the invited address (prefilled) and lands on the bench', async () => {
    const { page } = browser;
    const form = page.getByRole('form', { name: 'Create your account and join' });
    expect(await form.getByLabel('E-mail').inputValue()).toBe(COLLEAGUE.email);
    await form.getByLabel('Name').fill(COLLEAGUE.name);
    await form.getByLabel('Password').fill(COLLEAGUE.password);
    await screenshots(page, 'invite-accept');
    await form.getByRole('button', { name: 'Create account and join' }).click();
    await page.waitForURL(new RegExp(`/benches/${benchId}$`));
    await page.getByRole('heading', { level: 1, name: DEMO.bench }).waitFor();
    await page.getByTestId('capture-list').waitFor();
    const me = await apiInPage<{ user: { email: string } }>('GET', '/api/me');
    expect(me.body.user.email).toBe(COLLEAGUE.email);
  });

  it('sees the bench’s spectra with the owner’s mark', async () => {
    const { page } = browser;
    await page.goto(url(`/benches/${benchId}/spectra/${markedAnalysisId}`));
    const marks = page.getByTestId('marks-list');
    await marks.waitFor();
    await marks.getByText(MARK_TEXT).waitFor();
    await screenshots(page, 'invite-colleague-spectrum');
  });

  it('the used link shows a clear page that it can no longer be used', async () => {
    const { page } = browser;
    await page.goto(invitationLink);
    await page.getByText('This invitation can no longer be used').waitFor();
    expect(await page.getByRole('alert').innerText()).toMatch(/used already/);
  });

  it('the owner reads the invitation and its acceptance in the audit trail, filtered by action', async () => {
    const { page } = browser;
    await page.evaluate(() => fetch('/api/auth/sign-out', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: '{}' }));
    await browser.context.clearCookies();
    await page.goto(url('/sign-in'));
    await page.getByLabel('E-mail').fill(DEMO.owner.email);
    await page.getByLabel('Password').fill(DEMO.owner.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/benches$/);
    await page.goto(url(`/benches/${benchId}/members`));
    await page.getByRole('link', { name: 'audit trail' }).click();
    await page.getByRole('heading', { level: 1, name: 'Audit trail' }).waitFor();
    const table = page.getByRole('table', { name: 'Audit trail' });
    await table.getByRole('row', { name: /uploaded a capture/ }).first().waitFor();
    const filters = page.getByRole('form', { name: 'Filter the audit trail' });
    await filters.getByLabel('Action').selectOption('invitation.accepted');
    await filters.getByRole('button', { name: 'Apply' }).click();
    await table.getByRole('row', { name: new RegExp(`${COLLEAGUE.name}.*accepted an invitation.*${COLLEAGUE.email}`) }).waitFor();
    // the accepted row is in the unfiltered list too: wait until the filtered list has replaced it
    await expect.poll(() => table.getByRole('row', { name: /uploaded a capture/ }).count(), { timeout: 10_000 }).toBe(0);
    expect(await table.getByRole('row', { name: new RegExp(`${COLLEAGUE.name}.*accepted an invitation`) }).count()).toBe(1);
    await screenshots(page, 'invite-audit');
    expect(consoleErrors).toEqual([]);
  });
});
