// The link budget in a real browser against the real server and MariaDB: the analyst Tomas Aalto opens the
// link-budget page from the bench home, evaluates QPSK at 32 GBd from two linewidths (transmitter 6 MHz,
// local oscillator 7.1 MHz: 13.1 MHz summed, at the published tolerance of Pfau, Hoffmann, Noé, J. Lightwave
// Technol. 27(8), 989-999 (2009), Δν·T_s = 4.1e-4 — METHODS 7.2), sees the verdict with its source, the
// caution and the table across symbol rates, then saves the budget and sees it listed; a negative symbol
// rate is refused beside its field. Screenshots go to test-results/e2e/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshots, startE2eServer, type E2eBrowser, type E2eServer } from '../helpers/e2e-server';

let server: E2eServer;
let browser: E2eBrowser;
const consoleErrors: string[] = [];
let benchId = '';

const stamp = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
const person = { name: 'Tomas Aalto', email: `tomas.aalto+budget${stamp}@example.org`, password: 'larchmere-demo-2026' };

const url = (p: string) => `${server.baseUrl}${p}`;
const squash = (t: string) => t.replace(/[\s\u00a0]+/g, ' ').trim();

beforeAll(async () => {
  server = await startE2eServer();
  browser = await launchBrowser();
  browser.page.on('console', (m) => {
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) consoleErrors.push(m.text());
  });
  browser.page.on('pageerror', (e) => consoleErrors.push(e.message));
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('link budget page in chromium', () => {
  it('the bench home links to the link budgets of the bench', async () => {
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
    await page.getByRole('link', { name: 'Link budgets' }).click();
    await page.waitForURL(/\/link-budgets$/);
    await page.getByRole('heading', { level: 1, name: 'Link budget' }).waitFor();
    await page.getByText('No budgets saved on this bench yet.').waitFor();
  });

  it('a negative symbol rate is refused beside its field, before anything is sent', async () => {
    const { page } = browser;
    await page.getByLabel('Symbol rate').fill('-32');
    await page.getByRole('button', { name: 'Evaluate the budget' }).click();
    await page.getByText('Must be positive.').waitFor();
    expect(await page.getByLabel('Symbol rate').getAttribute('aria-invalid')).toBe('true');
    await page.getByLabel('Symbol rate').fill('32');
  });

  it('evaluating from two linewidths shows the verdict with its source, the caution and the table across symbol rates', async () => {
    const { page } = browser;
    await page.getByLabel('Modulation format').selectOption('QPSK');
    await page.locator('input[name="transmitter-linewidth"]').fill('6000');
    await page.locator('input[name="localOscillator-linewidth"]').fill('7100');
    await page.getByRole('button', { name: 'Evaluate the budget' }).click();
    const verdict = page.getByTestId('budget-verdict');
    await verdict.waitFor();
    expect(squash(await verdict.innerText())).toMatch(/^Within tolerance within the published tolerance by 0\.0\d dB/);
    const figures = squash(await page.locator('section[aria-labelledby="budget-result-heading"]').innerText());
    expect(figures).toContain('13.1 MHz');
    expect(figures).toContain('4.09 × 10⁻⁴'); // Δν·T_s = 13.1 MHz / 32 GBd
    expect(figures).toContain('4.1 × 10⁻⁴'); // Pfau et al. 2009, QPSK
    expect(figures).toMatch(/Pfau, Hoffmann, No/);
    const caution = squash(await page.getByTestId('budget-caution').innerText());
    expect(caution).toMatch(/estimate/);
    expect(caution).toMatch(/confirm it on the link/);
    expect(caution).toMatch(/licensed/);
    const rows = page.getByTestId('budget-table').locator('tbody tr');
    expect(await rows.count()).toBe(6);
    // a quarter of the symbol rate: four times Δν·T_s, 6 dB beyond the tolerance
    expect(squash(await rows.nth(0).innerText())).toBe('8.00 GBd 13.1 MHz 1.64 × 10⁻³ −6.0 dB exceeds');
    expect(squash(await rows.nth(3).innerText())).toBe('64.0 GBd 13.1 MHz 2.05 × 10⁻⁴ 3.0 dB within');
    expect(squash(await rows.nth(2).innerText())).toMatch(/^32\.0 GBd 13\.1 MHz 4\.09 × 10⁻⁴ 0\.0 dB within$/);
    await screenshots(page, 'link-budget-01-evaluated');
  });

  it('saving it puts it on the bench; it is listed and opens again', async () => {
    const { page } = browser;
    await page.getByLabel('Name').fill('Kestrel transmitter with Wren LO, 32 GBd QPSK');
    await page.getByRole('button', { name: 'Save on the bench' }).click();
    await page.getByText('Saved on the bench as “Kestrel transmitter with Wren LO, 32 GBd QPSK”.').waitFor();
    const list = page.getByRole('list', { name: 'Saved link budgets' });
    await list.waitFor();
    expect(squash(await list.innerText())).toMatch(/Kestrel transmitter with Wren LO, 32 GBd QPSK QPSK at 32\.0 GBd · Δν 13\.1 MHz · within/);
    const saved = await page.evaluate(async (id) => (await (await fetch(`/api/benches/${id}/link-budgets`)).json()).linkBudgets, benchId);
    expect(saved).toHaveLength(1);
    expect(saved[0].input).toEqual({ format: 'QPSK', symbolRateBaud: 32e9, transmitter: { linewidthHz: 6e6 }, localOscillator: { linewidthHz: 7.1e6 } });
    await screenshots(page, 'link-budget-02-saved');
    await page.reload();
    await list.getByRole('button', { name: 'Open' }).click();
    await page.getByRole('heading', { name: 'Result — Kestrel transmitter with Wren LO, 32 GBd QPSK' }).waitFor();
    expect(await page.locator('input[name="transmitter-linewidth"]').inputValue()).toBe('6000');
    await screenshots(page, 'link-budget-03-opened');
    expect(consoleErrors).toEqual([]);
  });
});
