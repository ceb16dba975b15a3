// Overlays and share links in a real browser against the real server, job runner and MariaDB: the
// demo analyst uploads two demo captures, makes an overlay of their spectra (legend and figures table shown), makes a share
// link, a fresh browser with no cookie opens it and sees the plot and the figures and nothing of the
// bench's people; the analyst revokes it and the fresh browser then gets the clear 410 page.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_CAPTURES } from '../../server/modules/captures/demo-captures';
import { launchBrowser, projectRoot, screenshots, startE2eServer, type E2eBrowser, type E2eServer } from '../helpers/e2e-server';

const DEMO = {
  analyst: { email: 'tomas.aalto@example.org', password: 'larchmere-demo-2026', name: 'Tomas Aalto' },
  bench: 'Larchmere narrow-linewidth bench',
};
const OVERLAY_NAME = 'Kestrel against Wren';

let server: E2eServer;
let browser: E2eBrowser;
let outsider: E2eBrowser | undefined;
let benchId = '';
let shareUrl = '';
const consoleErrors: string[] = [];

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

function runNode(args: string[], env: NodeJS.ProcessEnv): Promise<{ code: number; output: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { cwd: projectRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout.on('data', (d) => (output += d));
    child.stderr.on('data', (d) => (output += d));
    child.on('error', reject);
    child.on('exit', (code) => resolve({ code: code ?? -1, output }));
  });
}

const url = (p: string) => `${server.baseUrl}${p}`;

beforeAll(async () => {
  server = await startE2eServer();
  const seeded = await runNode(['--import', 'tsx', 'scripts/seed-demo.ts'], testEnv());
  if (seeded.code !== 0) throw new Error(`the demo seed failed:\n${seeded.output}`);
  browser = await launchBrowser();
  browser.page.on('pageerror', (e) => consoleErrors.push(e.message));
}, 240_000);

afterAll(async () => {
  await outsider?.close();
  await browser?.close();
  await server?.stop();
});

describe('overlays and share links in chromium', () => {
  it('the demo analyst signs in, uploads two demo captures and they are analysed', async () => {
    const { page } = browser;
    await page.goto(url('/sign-in'));
    await page.getByLabel('E-mail').fill(DEMO.analyst.email);
    await page.getByLabel('Password').fill(DEMO.analyst.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/benches$/);
    // two demo samples, uploaded through the API from the signed-in page with what the file cannot tell
    const uploads = ['kestrel-ecl-1550-iq.npy', 'wren-dfb-1549-iq-int16.bin'].map((file) => {
      const demo = DEMO_CAPTURES.find((d) => d.file === file)!;
      const fields: Record<string, string> = {};
      for (const key of ['sampleRateHz', 'dtype', 'channels', 'driveCurrentMa', 'temperatureC', 'outputPowerMw'] as const) {
        const v = demo.fields[key];
        if (v !== undefined) fields[key] = String(v);
      }
      return { file, laser: demo.laser, fields, base64: readFileSync(path.join(projectRoot, 'samples', file)).toString('base64') };
    });
    benchId = await page.evaluate(
      async ({ benchName, uploads }) => {
        const benches = (await (await fetch('/api/benches')).json()) as { benches: { id: string; name: string }[] };
        const bench = benches.benches.find((b) => b.name === benchName)!;
        const lasers = (await (await fetch(`/api/benches/${bench.id}/lasers`)).json()) as { lasers: { id: string; name: string }[] };
        const list = (await (await fetch(`/api/benches/${bench.id}/captures?pageSize=100`)).json()) as { captures: { fileName: string }[] };
        for (const u of uploads) {
          if (list.captures.some((c) => c.fileName === u.file)) continue;
          const form = new FormData();
          for (const [k, v] of Object.entries(u.fields)) form.append(k, v);
          const laser = lasers.lasers.find((l) => l.name === u.laser);
          if (laser) form.append('laserId', laser.id);
          const bytes = Uint8Array.from(atob(u.base64), (c) => c.charCodeAt(0));
          form.append('file', new Blob([bytes]), u.file);
          const res = await fetch(`/api/benches/${bench.id}/captures`, { method: 'POST', body: form });
          if (res.status !== 201) throw new Error(`upload of ${u.file}: ${res.status} ${await res.text()}`);
        }
        return bench.id;
      },
      { benchName: DEMO.bench, uploads },
    );
    expect(benchId).toMatch(/^[a-z2-7]{24}$/);
    // the server's job runner analyses them: wait until both are done
    const deadline = Date.now() + 240_000;
    let done = 0;
    while (Date.now() < deadline) {
      done = await page.evaluate(async (id) => {
        const list = (await (await fetch(`/api/benches/${id}/captures?pageSize=100`)).json()) as { captures: { latestAnalysis: { status: string } | null }[] };
        return list.captures.filter((c) => c.latestAnalysis?.status === 'done').length;
      }, benchId);
      if (done >= 2) break;
      await new Promise((r) => setTimeout(r, 1000));
    }
    expect(done).toBeGreaterThanOrEqual(2);
  }, 300_000);

  it('makes an overlay of two demo spectra: legend on the plot and the figures side by side', async () => {
    const { page } = browser;
    await page.goto(url(`/benches/${benchId}/overlays`));
    await page.getByRole('heading', { level: 1, name: 'Overlays' }).waitFor();
    await page.getByLabel('Overlay name').fill(OVERLAY_NAME);
    const boxes = page.getByRole('form', { name: 'New overlay' }).getByRole('checkbox');
    await boxes.nth(0).check();
    await boxes.nth(1).check();
    await page.getByRole('button', { name: 'Save overlay' }).click();
    await page.waitForURL(/\/overlays\/[a-z2-7]{24}$/);
    await page.getByRole('heading', { level: 1, name: OVERLAY_NAME }).waitFor();
    const legend = page.locator('[data-testid="overlay-plot"] svg g[data-legend] text');
    await legend.nth(1).waitFor();
    expect(await legend.count()).toBe(2);
    // two traces in the first two Okabe–Ito colours of the overlay palette
    const strokes = await page.locator('[data-testid="overlay-plot"] svg g[data-legend] line').evaluateAll((ls) => ls.map((l) => l.getAttribute('stroke')));
    expect(strokes).toEqual(['#0072B2', '#D55E00']);
    const table = page.getByTestId('overlay-figures');
    await table.getByRole('rowheader', { name: 'Intrinsic linewidth' }).waitFor();
    expect(await table.getByRole('columnheader').count()).toBe(3);
    expect(await table.locator('tbody tr').first().locator('td').allInnerTexts()).toHaveLength(2);
    await screenshots(page, 'overlay-two-demo-spectra');
  }, 60_000);

  it('makes a share link and a fresh browser without a cookie sees the plot and the figures', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Share' }).click();
    await page.getByRole('button', { name: 'Make link' }).click();
    const input = page.getByRole('textbox', { name: 'Share link' });
    await input.waitFor();
    shareUrl = await input.inputValue();
    expect(shareUrl).toMatch(/\/shared\/[A-Za-z0-9_-]{43}$/);

    outsider = await launchBrowser();
    expect(await outsider.context.cookies()).toHaveLength(0);
    const p = outsider.page;
    p.on('pageerror', (e) => consoleErrors.push(e.message));
    await p.goto(shareUrl);
    await p.getByRole('heading', { level: 1, name: OVERLAY_NAME }).waitFor();
    await p.locator('[data-testid="overlay-plot"] svg path[stroke="#0072B2"]').first().waitFor();
    await p.getByTestId('overlay-figures').getByRole('rowheader', { name: 'β-line linewidth' }).waitFor();
    await p.getByRole('heading', { name: 'Where the data came from' }).waitFor();
    const text = await p.locator('body').innerText();
    expect(text).not.toContain(DEMO.analyst.name);
    expect(text).not.toContain(DEMO.analyst.email);
    expect(text).not.toContain(DEMO.bench);
    expect(await p.locator(`a[href*="${benchId}"]`).count()).toBe(0);
    await screenshots(p, 'share-link-opened-without-sign-in');
  }, 60_000);

  it('once revoked, the fresh browser gets the clear 410 page', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Done' }).click();
    const list = page.getByRole('list', { name: 'Share links' });
    await list.getByRole('button', { name: 'Revoke' }).first().click();
    await list.locator('li[data-state="revoked"]').first().waitFor();
    const p = outsider!.page;
    await p.goto(shareUrl);
    const note = p.getByTestId('shared-error');
    await note.waitFor();
    expect(await note.getAttribute('data-status')).toBe('410');
    await p.getByRole('heading', { level: 1, name: 'This shared link no longer works' }).waitFor();
    await screenshots(p, 'share-link-revoked-410');
    // the bench's overlays page lists the overlay and the link, now revoked
    await page.goto(url(`/benches/${benchId}/overlays`));
    await page.getByRole('link', { name: OVERLAY_NAME }).first().waitFor();
    await page.getByRole('list', { name: 'Share links' }).locator('li[data-state="revoked"]').first().waitFor();
    await screenshots(page, 'overlays-page-with-share-links');
    expect(consoleErrors).toEqual([]);
  }, 60_000);

  it('the laser page links to its sweep: points plotted with D3 and, with one capture, the reason there is no 1/P fit', async () => {
    const { page } = browser;
    await page.goto(url(`/benches/${benchId}`));
    await page.getByRole('link', { name: 'Kestrel ECL-1550' }).first().click();
    await page.getByTestId('laser-sweep').click();
    await page.waitForURL(/\/sweep$/);
    await page.getByRole('button', { name: /Output power/ }).click();
    await page.locator('[data-testid="sweep-plot"] svg circle').first().waitFor();
    await page.getByText('Output power P (mW)').first().waitFor();
    expect(await page.getByTestId('sweep-no-fit').first().innerText()).toMatch(/at least 3/);
    await screenshots(page, 'sweep-kestrel-output-power');
  }, 60_000);
});
