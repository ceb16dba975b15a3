// The foundation in a real browser against the real server and MariaDB: sign up, start a bench,
// add a laser by wavelength and see its optical frequency, sign out, sign in again and find both.
// 1550.12 nm ↔ 193.40 THz is a channel of the ITU-T G.694.1 DWDM grid (from memory); ν = c/λ with
// c = 299 792 458 m/s gives 193.3995 THz, shown to 1 GHz as 193.400 THz.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshots, startE2eServer, type E2eBrowser, type E2eServer } from '../helpers/e2e-server';

let server: E2eServer;
let browser: E2eBrowser;
const consoleErrors: string[] = [];

const stamp = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
const person = {
  name: 'Mira Kestner',
  email: `mira.kestner+${stamp}@example.org`,
  password: 'larchmere-demo-2026',
};
const benchName = 'Larchmere narrow-linewidth bench';
const laserName = 'Kestrel ECL-1550';
let benchPath = '';

beforeAll(async () => {
  server = await startE2eServer();
  browser = await launchBrowser();
  browser.page.on('console', (m) => {
    // a 401 from GET /api/me or a 409 the form shows are answers, not page errors
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) consoleErrors.push(m.text());
  });
  browser.page.on('pageerror', (e) => consoleErrors.push(e.message));
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const url = (p: string) => `${server.baseUrl}${p}`;

describe('foundation flow in chromium', () => {
  it('a signed-out visit to /benches lands on /sign-in and keeps the intended address', async () => {
    const { page } = browser;
    await page.goto(url('/benches'));
    await page.waitForURL(/\/sign-in\?redirectTo=%2Fbenches$/);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await screenshots(page, '01-sign-in');
  });

  it('the page uses the paper background and the bundled Inter and JetBrains Mono fonts', async () => {
    const { page } = browser;
    const look = await page.evaluate(async () => {
      await document.fonts.ready;
      await Promise.all([document.fonts.load('16px Inter'), document.fonts.load('16px "JetBrains Mono"')]);
      return {
        background: getComputedStyle(document.documentElement).backgroundColor,
        inter: document.fonts.check('16px Inter'),
        mono: document.fonts.check('16px "JetBrains Mono"'),
        bodyFont: getComputedStyle(document.body).fontFamily,
      };
    });
    expect(look.background).toBe('rgb(247, 243, 234)'); // paper #f7f3ea
    expect(look.inter).toBe(true);
    expect(look.mono).toBe(true);
    expect(look.bodyFont).toMatch(/^Inter/);
  });

  it('the first Tab reaches the skip link', async () => {
    const { page } = browser;
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Skip to content');
  });

  it('sign-up shows the contract message beside the password field before anything is sent', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.waitForURL(/\/sign-up\?redirectTo=%2Fbenches$/);
    await page.getByLabel('Name').fill(person.name);
    await page.getByLabel('E-mail').fill(person.email);
    await page.getByLabel('Password').fill('too-short');
    await page.getByRole('button', { name: 'Create account' }).click();
    const password = page.getByLabel('Password');
    await page.getByText('Must be at least 12 characters.').waitFor();
    expect(await password.getAttribute('aria-invalid')).toBe('true');
    await screenshots(page, '02-sign-up-error');
  });

  it('sign-up with a good password signs in and opens the intended /benches, empty', async () => {
    const { page } = browser;
    await page.getByLabel('Password').fill(person.password);
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.waitForURL(/\/benches$/);
    await page.getByText('You are not on any bench yet.').waitFor();
    await screenshots(page, '03-benches-empty');
  });

  it('starting a bench opens its home with no lasers and the laser-safety caution', async () => {
    const { page } = browser;
    await page.getByLabel('Name').fill(benchName);
    await page.getByLabel('Description').fill('Self-heterodyne and beat-note measurements of 1550 nm sources against the reference cavity laser.');
    await page.getByRole('button', { name: 'Start bench' }).click();
    await page.waitForURL(/\/benches\/[a-z2-7]{24}$/);
    benchPath = new URL(page.url()).pathname;
    await page.getByRole('heading', { level: 1, name: benchName }).waitFor();
    await page.getByText('No lasers on this bench yet.').waitFor();
    await page.getByText(/follow your site's laser-safety rules and the classification of your sources \(IEC 60825-1\)/).waitFor();
    await screenshots(page, '04-bench-home-empty');
  });

  it('adding a laser at 1550.12 nm shows 193.400 THz, first as a preview and then in the table', async () => {
    const { page } = browser;
    const form = page.getByRole('form', { name: 'Add a laser' });
    await form.getByLabel('Name').fill(laserName);
    await form.getByLabel('Type').selectOption('external-cavity');
    await form.getByLabel('Wavelength').fill('1550.12');
    await form.getByText(/ν = c\/λ = 193\.400\s+THz/).waitFor();
    await form.getByLabel('Notes').fill('Quiet reference-grade source; 120 mA, 25.0 °C.');
    await screenshots(page, '05-laser-form-filled');
    await form.getByRole('button', { name: 'Add laser' }).click();
    const row = page.getByRole('row', { name: new RegExp(laserName) });
    await row.waitFor();
    const text = (await row.innerText()).replace(/\s+/g, ' ');
    expect(text).toContain('External cavity');
    expect(text).toMatch(/1550\.12 nm/);
    expect(text).toMatch(/193\.400 THz/);
    // numbers and units are set in JetBrains Mono
    const font = await row.getByText(/193\.400/).evaluate((el) => getComputedStyle(el).fontFamily);
    expect(font).toMatch(/JetBrains Mono/);
    await screenshots(page, '06-bench-home-laser');
  });

  it('a second laser with the same name is refused and the server message shows on the form', async () => {
    const { page } = browser;
    const form = page.getByRole('form', { name: 'Add a laser' });
    await form.getByLabel('Name').fill(laserName);
    await form.getByRole('button', { name: 'Add laser' }).click();
    await form.getByRole('alert').waitFor();
    expect(await form.getByRole('alert').innerText()).not.toBe('');
    await form.getByLabel('Name').fill('');
  });

  it('the members page lists the creator as owner', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'Members' }).first().click();
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();
    const row = page.getByRole('row', { name: new RegExp(person.name) });
    await row.waitFor();
    expect(await row.getByRole('combobox').inputValue()).toBe('owner');
    await screenshots(page, '07-members');
  });

  it('the account page shows name and e-mail, and signing out returns to /sign-in', async () => {
    const { page } = browser;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Account' }).click();
    await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
    await page.getByText(person.email).waitFor();
    await screenshots(page, '08-account');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in$/);
    const me = await page.evaluate(async () => (await fetch('/api/me')).status);
    expect(me).toBe(401);
  });

  it('signing in again from the bench address returns to the bench with its laser', async () => {
    const { page } = browser;
    await page.goto(url(benchPath));
    await page.waitForURL(new RegExp(`/sign-in\\?redirectTo=${encodeURIComponent(benchPath)}$`));
    await page.getByLabel('E-mail').fill(person.email);
    await page.getByLabel('Password').fill(person.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(new RegExp(`${benchPath}$`));
    await page.getByRole('heading', { level: 1, name: benchName }).waitFor();
    const row = page.getByRole('row', { name: new RegExp(laserName) });
    expect((await row.innerText()).replace(/\s+/g, ' ')).toMatch(/193\.400 THz/);
  });

  it('the bench list shows the bench with one laser', async () => {
    const { page } = browser;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Benches' }).click();
    await page.waitForURL(/\/benches$/);
    const entry = page.getByRole('list', { name: 'Your benches' }).getByRole('listitem').filter({ hasText: benchName });
    await entry.waitFor();
    expect((await entry.innerText()).replace(/\s+/g, ' ')).toMatch(/lasers 1/);
    await screenshots(page, '09-benches');
  });

  it('editing a laser by optical frequency 193.500 THz stores 1549.32 nm (ITU-T G.694.1 grid pair)', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: benchName }).click();
    await page.getByRole('heading', { level: 1, name: benchName }).waitFor();
    await page.getByRole('button', { name: `Edit ${laserName}` }).click();
    const form = page.getByRole('form', { name: `Edit ${laserName}` });
    await form.getByText('ν in THz').click();
    // switching carries the value over, converted
    expect(await form.getByLabel('Optical frequency').inputValue()).toBe('193.400');
    await form.getByLabel('Optical frequency').fill('193.5');
    await form.getByText(/λ = c\/ν = 1549\.315\s+nm/).waitFor();
    await form.getByRole('button', { name: 'Save laser' }).click();
    await form.waitFor({ state: 'detached' });
    const row = page.getByRole('row', { name: new RegExp(laserName) });
    const text = (await row.innerText()).replace(/\s+/g, ' ');
    expect(text).toMatch(/1549\.315 nm/); // c/193.5 THz = 1549.3150… nm
    expect(text).toMatch(/193\.500 THz/);
  });

  it('a wavelength that is not a number is refused beside the field, before anything is sent', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: `Edit ${laserName}` }).click();
    const form = page.getByRole('form', { name: `Edit ${laserName}` });
    await form.getByText('λ in nm').click();
    await form.getByLabel('Wavelength').fill('15x0');
    await form.getByRole('button', { name: 'Save laser' }).click();
    await form.getByText('Must be a number, e.g. 1550.12.').waitFor();
    expect(await form.getByLabel('Wavelength').getAttribute('aria-invalid')).toBe('true');
    await form.getByRole('button', { name: 'Cancel' }).click();
  });

  it('the owner adds an existing account as viewer, makes them analyst, then removes them', async () => {
    const { page } = browser;
    // a colleague signs up on their own (outside this browser session)
    const colleague = { name: 'Tomas Aalto', email: `tomas.aalto+${stamp}@example.org`, password: person.password };
    const res = await fetch(url('/api/auth/sign-up'), {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Origin: server.baseUrl },
      body: JSON.stringify(colleague),
    });
    expect(res.status).toBe(201);

    await page.goto(url(`${benchPath}/members`));
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();
    const form = page.getByRole('form', { name: 'Add a member' });
    await form.getByLabel('E-mail').fill('nobody.here@example.org');
    await form.getByRole('button', { name: 'Add member' }).click();
    await form.getByRole('alert').waitFor(); // no account with that e-mail
    await form.getByLabel('E-mail').fill(colleague.email);
    await form.getByLabel('Role').selectOption('viewer');
    await form.getByRole('button', { name: 'Add member' }).click();
    await form.getByText(`${colleague.name} joined as viewer.`).waitFor();

    const row = page.getByRole('row', { name: new RegExp(colleague.name) });
    await row.getByRole('combobox', { name: `Role of ${colleague.name}` }).selectOption('analyst');
    await row.getByRole('button', { name: 'Change role' }).click();
    await row.getByText('Role changed.').waitFor();
    await screenshots(page, '10-members-two');

    await row.getByRole('button', { name: 'Remove' }).click();
    const dialog = page.getByRole('dialog', { name: `Remove ${colleague.name}?` });
    await dialog.getByRole('button', { name: 'Remove member' }).click();
    await row.waitFor({ state: 'detached' });
  });

  it('removing the laser asks first, then the bench is empty again', async () => {
    const { page } = browser;
    await page.goto(url(benchPath));
    await page.getByRole('button', { name: `Remove ${laserName}` }).click();
    const dialog = page.getByRole('dialog', { name: `Remove ${laserName}?` });
    await dialog.getByRole('button', { name: 'Keep it' }).waitFor();
    await dialog.getByRole('button', { name: 'Remove laser' }).click();
    await page.getByText('No lasers on this bench yet.').waitFor();
  });

  it('no page logged an error in the browser console', () => {
    expect(consoleErrors).toEqual([]);
  });
});
