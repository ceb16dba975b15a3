// From upload to spectrum in a real browser against the real server, job runner and MariaDB:
// the demo analyst uploads a demo capture, watches the bytes and the analysis stages, lands on the
// spectrum page, and the intrinsic linewidth shown there agrees with the analysis CLI's figure for
// the same file and settings to the precision shown (3 significant digits). Then the view switch,
// the movable white-floor band, zoom, and the exports (the CSV download is read back).
// A viewer sees no upload; a file the engine cannot read is refused with its reason beside the form.
import { spawn } from 'node:child_process';
import { readFileSync, writeFileSync, mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatSI } from '../../src/lib/units';
import { launchBrowser, projectRoot, screenshots, screenshotDir, startE2eServer, type E2eBrowser, type E2eServer } from '../helpers/e2e-server';

/**
 * The demo capture uploaded (written by scripts/make-samples.ts; samples/README.md): complex64 IQ in
 * a NumPy file, which states no sample rate — so the form must ask for it (250 kHz, from the README).
 */
const SAMPLE = 'samples/kestrel-ecl-1550-iq.npy';
const SAMPLE_RATE_HZ = 250_000;
/** the analysis settings given on both sides (the rest are the engine's defaults on both) */
const SEGMENT = 16384;

const DEMO = {
  analyst: { email: 'tomas.aalto@example.org', password: 'larchmere-demo-2026' },
  viewer: { email: 'ines.vale@example.org', password: 'larchmere-demo-2026' },
  bench: 'Larchmere narrow-linewidth bench',
};

let server: E2eServer;
let browser: E2eBrowser;
const consoleErrors: string[] = [];
let spectrumPath = '';

/** The test database's environment, as the harness gives it to the server. */
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

function runNode(args: string[], env: NodeJS.ProcessEnv = process.env): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { cwd: projectRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('error', reject);
    child.on('exit', (code) => resolve({ code: code ?? -1, stdout, stderr }));
  });
}

const url = (p: string) => `${server.baseUrl}${p}`;
const squash = (s: string) => s.replace(/[\s\u00a0]+/g, ' ').trim();

async function signIn(email: string, password: string) {
  const { page } = browser;
  await page.goto(url('/sign-in'));
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/benches$/);
}

async function signOut() {
  const { page } = browser;
  await page.evaluate(async () => {
    await fetch('/api/auth/sign-out', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: '{}' });
  });
  await browser.context.clearCookies();
}

async function openDemoBench() {
  const { page } = browser;
  await page.goto(url('/benches'));
  await page.getByRole('link', { name: DEMO.bench }).first().click();
  await page.waitForURL(/\/benches\/[a-z2-7]{24}$/);
  await page.getByRole('heading', { level: 1, name: DEMO.bench }).waitFor();
}

beforeAll(async () => {
  server = await startE2eServer();
  // the demo people and bench (idempotent); the test database may be fresh
  const seeded = await runNode(['--import', 'tsx', 'scripts/seed-demo.ts'], testEnv());
  if (seeded.code !== 0) throw new Error(`the demo seed failed:\n${seeded.stdout}${seeded.stderr}`);
  browser = await launchBrowser();
  browser.page.on('console', (m) => {
    // answers the page shows (a 400 for the bad file, 401 before sign-in) are not page errors
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) consoleErrors.push(m.text());
  });
  browser.page.on('pageerror', (e) => consoleErrors.push(e.message));
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('spectrum page in chromium', () => {
  it('the demo analyst finds the upload on the bench home and the captures list', async () => {
    await signIn(DEMO.analyst.email, DEMO.analyst.password);
    await openDemoBench();
    const { page } = browser;
    await page.getByTestId('capture-list').waitFor();
    await page.getByRole('link', { name: 'Upload a capture' }).first().click();
    await page.waitForURL(/\/captures\/new$/);
    await page.getByRole('heading', { level: 1, name: 'Upload a capture' }).waitFor();
    await page.getByText(/follow your site's laser-safety rules and the classification of your sources \(IEC 60825-1\)/).first().waitFor();
  });

  it('choosing the sample shows the preview read in the browser: format, kind and first samples', async () => {
    const { page } = browser;
    await page.getByTestId('capture-file-input').setInputFiles(path.join(projectRoot, SAMPLE));
    const preview = page.getByTestId('capture-preview');
    await preview.waitFor();
    const text = squash(await preview.innerText());
    expect(text).toMatch(/NumPy \.npy · recognised from its first bytes/);
    expect(text).toMatch(/IQ \(I and Q\) · from the file/);
    expect(text).toMatch(/sample rate not stated in the file/);
    await page.getByText('First samples').waitFor();
    expect(squash(await page.getByTestId('preview-needs').innerText())).toMatch(/cannot tell the sample rate/);
    await page.getByLabel('Laser').selectOption({ label: 'Kestrel ECL-1550' });
    await page.getByText('Analysis settings').click();
    await page.getByLabel('Segment').fill(String(SEGMENT));
    await screenshots(page, 'spectrum-01-upload-preview');
  });

  it('the form refuses to send without the sample rate the file cannot tell, and says so beside the field', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Upload and analyse' }).click();
    const rate = page.getByLabel('Sample rate');
    await page.getByText(/The file does not state its sample rate/).waitFor();
    expect(await rate.getAttribute('aria-invalid')).toBe('true');
    // the first field with a message takes the focus
    expect(await rate.evaluate((el) => el === document.activeElement)).toBe(true);
    await rate.fill(String(SAMPLE_RATE_HZ));
    await page.getByText('= 250 kHz').waitFor();
    // with the rate the preview knows the record length: 131 072 samples at 250 kHz = 524 ms
    await page.getByTestId('capture-preview').getByText('524 ms').waitFor();
  });

  it('the upload shows its bytes, then the analysis stages, and opens the spectrum when done', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Upload and analyse' }).click();
    await page.getByTestId('upload-bytes').waitFor();
    await page.waitForURL(/\/benches\/[a-z2-7]{24}\/spectra\/[a-z2-7]{24}$/, { timeout: 120_000 });
    spectrumPath = new URL(page.url()).pathname;
    await page.getByTestId('intrinsic-linewidth').waitFor({ timeout: 60_000 });
    await page.getByTestId('spectrum-plot').locator('svg').first().waitFor();
    await page.evaluate(() => document.fonts.ready);
    await screenshots(page, 'spectrum-02-page');
  });

  it("the intrinsic linewidth on the page is the CLI's for the same file and settings, to the digits shown", async () => {
    const { page } = browser;
    const shown = squash(await page.getByTestId('intrinsic-linewidth').innerText());
    const cli = await runNode(['--import', 'tsx', 'analysis/cli.ts', SAMPLE, '--sample-rate', String(SAMPLE_RATE_HZ), '--segment', String(SEGMENT)]);
    expect(cli.code, cli.stderr).toBe(0);
    const report = JSON.parse(cli.stdout) as { intrinsicLinewidthHz: number };
    expect(report.intrinsicLinewidthHz).toBeGreaterThan(0);
    expect(shown).toBe(squash(formatSI(report.intrinsicLinewidthHz, 'Hz').text));
  });

  it('switching to L(f) redraws in dBc/Hz and keeps the view in the address', async () => {
    const { page } = browser;
    // the radios are visually hidden inside their labels: a person clicks the label
    await page.locator('label', { has: page.getByRole('radio', { name: /L\(f\)/ }) }).click();
    await page.waitForURL(/view=dbc/);
    // the URL changes first; the plot redraws on the next render
    const plotSvg = page.getByTestId('spectrum-plot').locator('svg').first();
    await expect.poll(() => plotSvg.textContent(), { timeout: 10_000 }).toContain('dBc/Hz');
    await screenshots(page, 'spectrum-03-dbc');
    await page.locator('label', { has: page.getByRole('radio', { name: /Sν — frequency-noise PSD/ }) }).click();
    await page.waitForURL((u) => !u.search.includes('view='));
    await expect.poll(() => plotSvg.textContent(), { timeout: 10_000 }).toContain('Hz²/Hz');
  });

  it('hovering reads out frequency and value; a drag zooms and a double-click goes back', async () => {
    const { page } = browser;
    const overlay = page.getByTestId('plot-overlay');
    const box = await overlay.boundingBox();
    if (!box) throw new Error('the plot has no overlay');
    await page.mouse.move(box.x + box.width * 0.55, box.y + box.height * 0.5);
    const readoutText = async () => squash(await page.getByTestId('plot-readout').innerText());
    await expect.poll(readoutText, { timeout: 10_000 }).toMatch(/^f \d[\d.]* [kMG]?Hz S ?ν \d/);
    const readout = await readoutText();
    expect(readout).toContain('Hz²/Hz');
    await page.mouse.move(box.x + box.width * 0.3, box.y + 20);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * 0.5, { steps: 5 });
    await page.mouse.move(box.x + box.width * 0.6, box.y + box.height * 0.7, { steps: 5 });
    await page.mouse.up();
    await page.getByText('(zoomed now)').waitFor();
    await screenshots(page, 'spectrum-04-zoomed');
    await overlay.dblclick();
    await page.getByText('(zoomed now)').waitFor({ state: 'detached' });
  });

  it('moving the white-floor band from the keyboard gives a new estimate and offers to run with it', async () => {
    const { page } = browser;
    const lower = page.getByRole('slider', { name: 'White-floor band, lower edge' });
    await lower.focus();
    for (let i = 0; i < 4; i++) await page.keyboard.press('Shift+ArrowLeft');
    const estimate = page.getByTestId('band-estimate');
    await estimate.waitFor();
    expect(squash(await estimate.innerText())).toMatch(/Band on the plot .*Hz – .*Hz: \d[\d.]* [kMG]?Hz/);
    await page.getByRole('button', { name: 'Run analysis with this band' }).waitFor();
    await screenshots(page, 'spectrum-05-band-moved');
    await page.getByRole('button', { name: 'Back to the analysis band' }).click();
    await estimate.waitFor({ state: 'detached' });
  });

  it('the CSV export downloads the full series with its header', async () => {
    const { page } = browser;
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/-series\.csv$/);
    const dir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-csv-'));
    const file = path.join(dir, download.suggestedFilename());
    await download.saveAs(file);
    const lines = readFileSync(file, 'utf8').trim().split(/\r?\n/);
    expect(lines[0]).toBe('frequency_hz,s_nu_hz2_per_hz');
    expect(lines.length).toBeGreaterThan(100);
    const rows = lines.slice(1).map((l) => l.split(',').map(Number));
    expect(rows.every((r) => r.length === 2 && r.every(Number.isFinite))).toBe(true);
    // ascending frequencies, non-negative densities
    expect(rows.every((r, i) => i === 0 || r[0] > rows[i - 1][0])).toBe(true);
    expect(rows.every((r) => r[1] >= 0)).toBe(true);
  });

  it('the JSON export holds the figures and the settings they came from', async () => {
    const { page } = browser;
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'JSON' }).click()]);
    const file = path.join(screenshotDir, 'spectrum-export.json');
    await download.saveAs(file);
    const doc = JSON.parse(readFileSync(file, 'utf8')) as {
      figures: { intrinsicLinewidthHz: number; betaLine: { observationTimeS: number } };
      settings: { segment: number; window: string };
      fileName: string;
    };
    expect(doc.fileName).toBe(path.basename(SAMPLE));
    expect(doc.settings.segment).toBe(SEGMENT);
    expect(doc.settings.window).toBe('hann');
    const shown = squash(await page.getByTestId('intrinsic-linewidth').innerText());
    expect(squash(formatSI(doc.figures.intrinsicLinewidthHz, 'Hz').text)).toBe(shown);
  });

  it('the SVG and PNG exports are standalone files of the plot', async () => {
    const { page } = browser;
    const [svgDownload] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'SVG' }).click()]);
    const svgFile = path.join(screenshotDir, 'spectrum-export.svg');
    await svgDownload.saveAs(svgFile);
    const svg = readFileSync(svgFile, 'utf8');
    expect(svg.startsWith('<?xml')).toBe(true);
    expect(svg).toContain('xmlns="http://www.w3.org/2000/svg"');
    expect(svg).toContain('@font-face');
    expect(svg).not.toContain('data-export="omit"');
    const [pngDownload] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'PNG' }).click()]);
    const pngFile = path.join(screenshotDir, 'spectrum-export.png');
    await pngDownload.saveAs(pngFile);
    const png = readFileSync(pngFile);
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
  });

  it('the bench home lists the capture with its headline figures and a link to the spectrum', async () => {
    const { page } = browser;
    await openDemoBench();
    const row = page.getByTestId('capture-row').filter({ hasText: path.basename(SAMPLE) }).first();
    await row.waitFor();
    const text = squash(await row.innerText());
    expect(text).toMatch(/analysed/);
    expect(text).toMatch(/Kestrel ECL-1550/);
    await screenshots(page, 'spectrum-06-bench-home');
    await row.getByRole('link', { name: 'Kestrel ECL-1550' }).click();
    await page.waitForURL(/\/lasers\/[a-z2-7]{24}$/);
    await page.getByTestId('laser-spectra').waitFor();
    await screenshots(page, 'spectrum-07-laser');
  });

  it('a file the engine cannot read is refused with its reason beside the upload, and nothing is listed', async () => {
    const { page } = browser;
    const dir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-bad-'));
    const bad = path.join(dir, 'broken-capture.npy');
    // a NumPy header that promises a million IQ pairs, followed by 16 bytes
    const header = "{'descr': '<f4', 'fortran_order': False, 'shape': (1000000, 2), }";
    const padded = header.padEnd(64 - 10 - 1, ' ') + '\n';
    const pre = Buffer.from([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, padded.length & 0xff, padded.length >> 8]);
    writeFileSync(bad, Buffer.concat([pre, Buffer.from(padded, 'latin1'), Buffer.alloc(16)]));
    await page.goto(url(`${new URL(page.url()).pathname.replace(/\/lasers\/.*$/, '')}/captures/new`));
    await page.getByTestId('capture-file-input').setInputFiles(bad);
    // the engine's reader, run in the browser on the first bytes, already sees it
    await page.getByTestId('preview-error').waitFor();
    await page.getByLabel('Sample rate').fill('1000');
    await page.getByRole('button', { name: 'Upload and analyse' }).click();
    // and the server's answer (400 with the engine's message) is said beside the upload button
    const alert = page.getByTestId('upload-error').getByRole('alert');
    await alert.waitFor();
    expect(squash(await alert.innerText())).toMatch(/truncated/);
    await screenshots(page, 'spectrum-08-bad-file');
    await page.goto(url(new URL(page.url()).pathname.replace(/\/captures\/new$/, '')));
    await page.getByTestId('capture-row').first().waitFor();
    expect(await page.getByTestId('capture-row').filter({ hasText: 'broken-capture.npy' }).count()).toBe(0);
  });

  it('a viewer sees the captures but no upload, and the upload page says why', async () => {
    const { page } = browser;
    await signOut();
    await signIn(DEMO.viewer.email, DEMO.viewer.password);
    await openDemoBench();
    await page.getByTestId('capture-list').waitFor();
    expect(await page.getByRole('link', { name: 'Upload a capture' }).count()).toBe(0);
    await page.goto(url(`${new URL(page.url()).pathname}/captures/new`));
    await page.getByText('Viewers read captures but do not upload them.').waitFor();
    await page.goto(url(spectrumPath));
    await page.getByTestId('intrinsic-linewidth').waitFor();
    expect(await page.getByRole('button', { name: 'Run a new analysis' }).count()).toBe(0);
  });

  it('no page logged an error in the browser console', () => {
    expect(consoleErrors).toEqual([]);
  });
});
