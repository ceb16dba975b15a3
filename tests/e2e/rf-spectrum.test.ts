// RF beat spectra in a real browser against the real server and MariaDB: a new analyst's bench, the
// link from the bench home, an upload of a spectrum-analyser trace written here (a Voigt line with
// f_L = 100 kHz and f_G = 80 kHz on a baseline, dBm, 1 % scatter), the trace with the three fitted lines
// and the results table;
// the figures on the page are the API's, as formatted; the dB/linear switch; an empty file refused with
// the server's reason and nothing listed. Screenshots go to test-results/e2e/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { voigtShape } from '../../analysis/rf/line-shapes';
import { formatSI } from '../../src/lib/units';
import { launchBrowser, screenshots, startE2eServer, type E2eBrowser, type E2eServer } from '../helpers/e2e-server';

let server: E2eServer;
let browser: E2eBrowser;
const consoleErrors: string[] = [];
let benchId = '';
let spectrumId = '';

const stamp = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
const person = { name: 'Tomas Aalto', email: `tomas.aalto+rf${stamp}@example.org`, password: 'larchmere-demo-2026' };

/** P = 1e-6 + 2e-3·V(f − f0; f_L = 100 kHz, f_G = 80 kHz)/V(0) mW, f0 = 80.02 MHz, 801 points over 4 MHz, in dBm with 1 % scatter. */
function traceCsv(): string {
  let s = 12345;
  const rnd = () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 31 - 1;
  };
  const rows = ['frequency (MHz),power (dBm)'];
  const peak = voigtShape(0, 100e3, 80e3);
  for (let i = 0; i < 801; i++) {
    const f = 80.02e6 - 2e6 + i * 5e3;
    const p = (1e-6 + (2e-3 * voigtShape(f - 80.02e6, 100e3, 80e3)) / peak) * (1 + 0.01 * rnd());
    rows.push(`${(f / 1e6).toFixed(6)},${(10 * Math.log10(p)).toFixed(5)}`);
  }
  return rows.join('\n') + '\n';
}

const url = (p: string) => `${server.baseUrl}${p}`;
const squash = (t: string) => t.replace(/[\s\u00a0]+/g, ' ').trim();

beforeAll(async () => {
  server = await startE2eServer();
  browser = await launchBrowser();
  browser.page.on('console', (m) => {
    // the 400 the form shows for the empty file is an answer, not a page error
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) consoleErrors.push(m.text());
  });
  browser.page.on('pageerror', (e) => consoleErrors.push(e.message));
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('RF spectrum page in chromium', () => {
  it('the bench home links to the RF spectra of the bench', async () => {
    const { page } = browser;
    await page.goto(url('/sign-in'));
    benchId = await page.evaluate(async (p) => {
      const headers = { 'Content-Type': 'application/json' };
      const up = await fetch('/api/auth/sign-up', { method: 'POST', headers, body: JSON.stringify(p) });
      if (up.status !== 201) throw new Error(`sign-up ${up.status}`);
      const b = await fetch('/api/benches', { method: 'POST', headers, body: JSON.stringify({ name: 'Larchmere narrow-linewidth bench' }) });
      return (await b.json()).bench.id as string;
    }, person);
    await page.goto(url(`/benches/${benchId}`));
    await page.getByRole('link', { name: 'RF spectra' }).click();
    await page.waitForURL(/\/rf-spectra$/);
    await page.getByRole('heading', { level: 1, name: 'RF beat spectra' }).waitFor();
    await page.getByText('No RF spectra on this bench yet.').waitFor();
  });

  it('an empty spectrum file is refused with the server reason, and nothing is listed', async () => {
    const { page } = browser;
    await page.getByLabel('Name').fill('Empty trace');
    await page.getByLabel('Spectrum file').setInputFiles({ name: 'empty.csv', mimeType: 'text/csv', buffer: Buffer.from('frequency (MHz),power (dBm)\n') });
    await page.getByRole('button', { name: 'Upload and fit' }).click();
    await page.getByText(/holds no data rows/).waitFor();
    await screenshots(page, 'rf-01-empty-refused');
    const list = await page.evaluate(async (id) => (await (await fetch(`/api/benches/${id}/rf-spectra`)).json()).rfSpectra.length, benchId);
    expect(list).toBe(0);
  });

  it('uploading a trace lands on its page with the measured trace, the three fits and the table', async () => {
    const { page } = browser;
    await page.getByLabel('Name').fill('Beat with the reference, 80 MHz');
    await page.getByLabel('Spectrum file').setInputFiles({ name: 'beat-80mhz.csv', mimeType: 'text/csv', buffer: Buffer.from(traceCsv()) });
    await page.getByRole('button', { name: 'Upload and fit' }).click();
    await page.waitForURL(/\/rf-spectra\/[a-z2-7]{24}$/);
    spectrumId = page.url().split('/').pop()!;
    await page.getByRole('heading', { level: 1, name: 'Beat with the reference, 80 MHz' }).waitFor();
    const plot = page.getByTestId('rf-fit-plot');
    await plot.locator('[data-testid="trace-measured"]').waitFor();
    expect(await plot.locator('[data-testid="trace-measured"] circle').count()).toBe(801);
    for (const s of ['lorentzian', 'gaussian', 'voigt']) {
      expect(await plot.locator(`[data-testid="trace-${s}"]`).getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+L/);
      await plot.locator(`[data-testid="legend-${s}"]`).waitFor();
    }
    await plot.locator('[data-testid="twenty-db-marker"]').waitFor();
    // the table shows the API's figures as formatted on the page
    const api = await page.evaluate(async (id) => (await (await fetch(`/api/rf-spectra/${id}`)).json()).rfSpectrum, spectrumId);
    const voigt = api.result.fits.find((f: { shape: string }) => f.shape === 'voigt');
    expect(Math.abs(voigt.lorentzianFwhmHz / 100e3 - 1)).toBeLessThan(0.03);
    expect(Math.abs(voigt.gaussianFwhmHz / 80e3 - 1)).toBeLessThan(0.03);
    const row = squash(await page.getByTestId('fit-row-voigt').innerText());
    expect(row).toContain(squash(formatSI(voigt.fwhmHz, 'Hz', { significant: 4 }).text));
    expect(row).toContain(`fL ${squash(formatSI(voigt.lorentzianFwhmHz, 'Hz', { significant: 4 }).text)} ±`);
    expect(row).toMatch(/Olivero–Longbothum; exact/);
    for (const s of ['lorentzian', 'gaussian']) expect(squash(await page.getByTestId(`fit-row-${s}`).innerText())).toMatch(/Hz ± /);
    expect(squash(await page.getByTestId('twenty-db-row').innerText())).toMatch(/read as a Lorentzian \(÷√99\)/);
    await screenshots(page, 'rf-02-spectrum-db');
  });

  it('the power axis switches between dB and linear', async () => {
    const { page } = browser;
    const firstPoint = page.getByTestId('trace-measured').locator('circle').first();
    const before = await firstPoint.getAttribute('cy');
    await page.getByRole('button', { name: 'Linear' }).click();
    await page.getByText('power (mW)').waitFor();
    expect(await page.getByRole('button', { name: 'Linear' }).getAttribute('aria-pressed')).toBe('true');
    expect(await firstPoint.getAttribute('cy')).not.toBe(before);
    await screenshots(page, 'rf-03-spectrum-linear');
  });

  it('the list shows the spectrum with its best fit; no page errors', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'RF spectra' }).click();
    await page.waitForURL(/\/rf-spectra$/);
    const list = squash(await page.getByTestId('rf-spectrum-list').innerText());
    expect(list).toMatch(/Beat with the reference, 80 MHz beat Voigt 14\d\.\d kHz 801/);
    await screenshots(page, 'rf-04-list');
    expect(consoleErrors).toEqual([]);
  });
});
