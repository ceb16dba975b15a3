// The printable spectrum report in a real browser against the real server, job runner and MariaDB:
// the demo analyst uploads the Wren DFB demo capture (50 Hz mains spur), marks the mains line and a
// band on its spectrum, sees them on the plot and in the list beside it, opens "Print report", and
// chromium prints the page to an A4 PDF. The PDF's text (read back from its content streams through
// each font's ToUnicode map, see pdfText below) holds the figures with their units as the API gives
// them, the marks, the provenance (file name, sha256, sample rate, operating point, settings, product
// version) and the laser-safety caution. The PDF and a print-media screenshot are kept in
// test-results/e2e/ for people to look at.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { inflateSync } from 'node:zlib';
import { spawn } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatScientific, formatSI } from '../../src/lib/units';
import { launchBrowser, projectRoot, screenshotDir, startE2eServer, type E2eBrowser, type E2eServer } from '../helpers/e2e-server';

const SAMPLE = 'samples/wren-dfb-1549-iq-int16.bin';
const FILE_NAME = 'wren-dfb-1549-iq-int16.bin';
const DEMO = {
  analyst: { email: 'tomas.aalto@example.org', password: 'larchmere-demo-2026' },
  bench: 'Larchmere narrow-linewidth bench',
};
const MAINS_TEXT = '50 Hz mains from the current driver';
const BAND_TEXT = 'servo bump of the offset lock';
const COMMENT_TEXT = 'The 50 Hz line goes away on the battery supply; keep the mark as a reminder.';
const HERON_FILE = 'heron-fl-1560-beat.wav';
const HERON_MARK = 'relaxation-oscillation peak';
const OVERLAY_NAME = 'Wren against Heron, report check';

// ---- PDF text, read without outside tools --------------------------------------------------------

interface PdfObject {
  dict: string;
  stream: Buffer | null;
}

/** Every indirect object `n 0 obj … endobj`, with its stream inflated when it is FlateDecode. */
function pdfObjects(pdf: Buffer): Map<number, PdfObject> {
  const text = pdf.toString('latin1');
  const objects = new Map<number, PdfObject>();
  const re = /(\d+)\s+0\s+obj\b/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text))) {
    const id = Number(m[1]);
    const start = m.index + m[0].length;
    const end = text.indexOf('endobj', start);
    if (end < 0) break;
    const body = text.slice(start, end);
    const s = body.search(/\bstream\r?\n/);
    let dict = body;
    let stream: Buffer | null = null;
    if (s >= 0) {
      dict = body.slice(0, s);
      const dataStart = start + s + body.slice(s).match(/^stream\r?\n/)![0].length;
      const lengthMatch = dict.match(/\/Length\s+(\d+)(?!\s+\d+\s+R)/);
      const dataEnd = lengthMatch ? dataStart + Number(lengthMatch[1]) : text.indexOf('endstream', dataStart);
      let data = pdf.subarray(dataStart, dataEnd);
      if (/\/FlateDecode/.test(dict)) data = inflateSync(data);
      stream = data;
    }
    objects.set(id, { dict, stream });
    re.lastIndex = end;
  }
  // objects kept inside object streams (/Type /ObjStm)
  for (const obj of [...objects.values()]) {
    if (!/\/Type\s*\/ObjStm/.test(obj.dict) || !obj.stream) continue;
    const n = Number(obj.dict.match(/\/N\s+(\d+)/)![1]);
    const first = Number(obj.dict.match(/\/First\s+(\d+)/)![1]);
    const s = obj.stream.toString('latin1');
    const header = s.slice(0, first).trim().split(/\s+/).map(Number);
    for (let i = 0; i < n; i++) {
      const from = first + header[2 * i + 1];
      const to = i + 1 < n ? first + header[2 * i + 3] : s.length;
      objects.set(header[2 * i], { dict: s.slice(from, to), stream: null });
    }
  }
  return objects;
}

/** code (hex) → text, from a ToUnicode CMap (bfchar and bfrange). */
function toUnicodeMap(cmap: string): Map<string, string> {
  const map = new Map<string, string>();
  const utf16 = (hex: string) => {
    let out = '';
    for (let i = 0; i + 4 <= hex.length; i += 4) out += String.fromCharCode(parseInt(hex.slice(i, i + 4), 16));
    return out;
  };
  for (const block of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const [, src, dst] of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]*)>/g)) map.set(src.toLowerCase(), utf16(dst));
  }
  for (const block of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const [, lo, hi, rest] of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(<[0-9a-fA-F]*>|\[[^\]]*\])/g)) {
      const a = parseInt(lo, 16);
      const b = parseInt(hi, 16);
      const width = lo.length;
      const targets = rest.startsWith('[') ? [...rest.matchAll(/<([0-9a-fA-F]*)>/g)].map((t) => t[1]) : null;
      const base = targets ? 0 : parseInt(rest.slice(1, -1), 16);
      const baseWidth = targets ? 0 : rest.length - 2;
      for (let c = a; c <= b; c++) {
        const key = c.toString(16).padStart(width, '0');
        map.set(key, targets ? utf16(targets[c - a] ?? '') : utf16((base + (c - a)).toString(16).padStart(baseWidth, '0')));
      }
    }
  }
  return map;
}

const ref = (dict: string, key: string): number | null => {
  const m = dict.match(new RegExp(`/${key}\\s+(\\d+)\\s+0\\s+R`));
  return m ? Number(m[1]) : null;
};

/**
 * The text of every page, in drawing order: strings shown with Tj/TJ/'/" decoded through the
 * current font's ToUnicode map; each text object (BT … ET) ends with a new line.
 */
function pdfText(pdf: Buffer): { pages: number; text: string } {
  const objects = pdfObjects(pdf);
  // a key's value: an indirect object's dictionary, or an inline << … >> taken with its nested dictionaries
  const deref = (dictText: string, key: string): string | null => {
    const id = ref(dictText, key);
    if (id !== null) return objects.get(id)?.dict ?? null;
    const at = dictText.search(new RegExp(`/${key}\\s*<<`));
    if (at < 0) return null;
    const open = dictText.indexOf('<<', at);
    let depth = 0;
    for (let i = open; i < dictText.length - 1; i++) {
      if (dictText.startsWith('<<', i)) {
        depth++;
        i++;
      } else if (dictText.startsWith('>>', i)) {
        depth--;
        i++;
        if (depth === 0) return dictText.slice(open, i + 1);
      }
    }
    return null;
  };
  let out = '';
  let pages = 0;
  for (const page of objects.values()) {
    if (!/\/Type\s*\/Page\b(?!s)/.test(page.dict)) continue;
    pages++;
    const resources = deref(page.dict, 'Resources') ?? '';
    const fontDict = deref(resources, 'Font') ?? '';
    const fonts = new Map<string, Map<string, string>>();
    for (const [, name, id] of fontDict.matchAll(/\/([^\s/<>]+)\s+(\d+)\s+0\s+R/g)) {
      const font = objects.get(Number(id));
      const tu = font ? ref(font.dict, 'ToUnicode') : null;
      const cmap = tu !== null ? objects.get(tu)?.stream?.toString('latin1') : undefined;
      fonts.set(name, cmap ? toUnicodeMap(cmap) : new Map());
    }
    const contentIds = (() => {
      const arr = page.dict.match(/\/Contents\s*\[([^\]]*)\]/);
      if (arr) return [...arr[1].matchAll(/(\d+)\s+0\s+R/g)].map((x) => Number(x[1]));
      const one = ref(page.dict, 'Contents');
      return one === null ? [] : [one];
    })();
    for (const id of contentIds) {
      const content = objects.get(id)?.stream?.toString('latin1') ?? '';
      let cmap = new Map<string, string>();
      let codeWidth = 4;
      const decodeHex = (hex: string) => {
        let t = '';
        for (let i = 0; i + codeWidth <= hex.length; i += codeWidth) t += cmap.get(hex.slice(i, i + codeWidth).toLowerCase()) ?? '';
        return t;
      };
      const tokens = content.match(/\/[^\s/[\]<>()]+|<[0-9a-fA-F\s]*>|\((?:\\.|[^\\)])*\)|\[|\]|-?[\d.]+|[A-Za-z'"*]+/g) ?? [];
      const operands: string[] = [];
      for (const tok of tokens) {
        if (tok === 'Tf') {
          const name = operands[operands.length - 2]?.slice(1) ?? '';
          cmap = fonts.get(name) ?? new Map();
          const anyKey = cmap.keys().next().value as string | undefined;
          codeWidth = anyKey ? anyKey.length : 4;
          operands.length = 0;
        } else if (tok === 'Tj' || tok === 'TJ' || tok === "'" || tok === '"') {
          for (const o of operands) {
            if (o.startsWith('<')) out += decodeHex(o.slice(1, -1).replace(/\s+/g, ''));
            else if (o.startsWith('(')) out += o.slice(1, -1);
            else if (/^-?[\d.]+$/.test(o) && Number(o) < -200) out += ' ';
          }
          operands.length = 0;
        } else if (tok === 'ET') {
          // a text object ends (a line, a label, a cell)
          out += '\n';
          operands.length = 0;
        } else if (/^[A-Za-z*]+$/.test(tok)) {
          operands.length = 0;
        } else if (tok !== '[' && tok !== ']') {
          operands.push(tok);
        }
      }
    }
    out += '\n\f\n';
  }
  return { pages, text: out };
}

// ---- the test ------------------------------------------------------------------------------------

let server: E2eServer;
let browser: E2eBrowser;
const consoleErrors: string[] = [];
const url = (p: string) => `${server.baseUrl}${p}`;
/** for finding text in a PDF: no spaces at all (a PDF places words, it need not draw the spaces) */
const bare = (s: string) => s.replace(/[\s\u00a0\u202f]+/g, '');

function runNode(args: string[], env: NodeJS.ProcessEnv): Promise<{ code: number; out: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { cwd: projectRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('error', reject);
    child.on('exit', (code) => resolve({ code: code ?? -1, out }));
  });
}

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

/** A same-origin JSON request from the page (cookie and Origin as the app itself sends them). */
async function inPage<T>(method: string, apiPath: string, body?: unknown): Promise<{ status: number; body: T }> {
  return browser.page.evaluate(
    async ({ method, apiPath, body }) => {
      const res = await fetch(apiPath, {
        method,
        headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await res.text();
      return { status: res.status, body: text ? JSON.parse(text) : null };
    },
    { method, apiPath, body },
  );
}

interface AnalysisJson {
  id: string;
  status: string;
  captureId: string;
  intrinsicLinewidthHz: number | null;
  betaLinewidthHz: number | null;
  lineshapeFwhmHz: number | null;
  whiteFloorHz2PerHz: number | null;
  result: { settings: { window: string; segment: number; averages: number }; whiteFloor: { bandHz: [number, number] | null } } | null;
}

let benchId = '';
let analysis: AnalysisJson;
let sha256 = '';
let pdf: Buffer;
let pdfPages = 0;
let pdfTextAll = '';

beforeAll(async () => {
  server = await startE2eServer();
  const seeded = await runNode(['--import', 'tsx', 'scripts/seed-demo.ts'], testEnv());
  if (seeded.code !== 0) throw new Error(`the demo seed failed:\n${seeded.out}`);
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

describe('spectrum report in chromium', () => {
  it('the demo analyst uploads the Wren DFB capture and its analysis finishes', async () => {
    const { page } = browser;
    await page.goto(url('/sign-in'));
    await page.getByLabel('E-mail').fill(DEMO.analyst.email);
    await page.getByLabel('Password').fill(DEMO.analyst.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/benches$/);

    const benches = await inPage<{ benches: { id: string; name: string }[] }>('GET', '/api/benches');
    benchId = benches.body.benches.find((b) => b.name === DEMO.bench)!.id;
    const lasers = await inPage<{ lasers: { id: string; name: string }[] }>('GET', `/api/benches/${benchId}/lasers`);
    const laserId = lasers.body.lasers.find((l) => l.name === 'Wren DFB-1549')!.id;
    const res = await page.request.post(url(`/api/benches/${benchId}/captures`), {
      headers: { Origin: server.baseUrl },
      multipart: {
        file: { name: FILE_NAME, mimeType: 'application/octet-stream', buffer: readFileSync(path.join(projectRoot, SAMPLE)) },
        kind: 'iq',
        format: 'raw',
        dtype: 'int16',
        channels: '2',
        sampleRateHz: '500000',
        laserId,
        setup: 'coherent-receiver',
        driveCurrentMa: '120',
        temperatureC: '30',
        outputPowerMw: '8',
      },
    });
    expect(res.status(), await res.text()).toBe(201);
    const created = (await res.json()) as { capture: { id: string; sha256: string }; analysis: { id: string } };
    sha256 = created.capture.sha256;
    expect(sha256).toMatch(/^[0-9a-f]{64}$/);
    const end = Date.now() + 120_000;
    for (;;) {
      const a = await inPage<AnalysisJson>('GET', `/api/analyses/${created.analysis.id}`);
      if (a.body.status === 'done' || a.body.status === 'failed') {
        analysis = a.body;
        break;
      }
      if (Date.now() > end) throw new Error(`analysis still ${a.body.status}`);
      await page.waitForTimeout(300);
    }
    expect(analysis.status).toBe('done');
  }, 180_000);

  it('marks added on the spectrum page show on the plot and in the list beside it; a comment joins the thread', async () => {
    const { page } = browser;
    await page.goto(url(`/benches/${benchId}/spectra/${analysis.id}`));
    await page.getByTestId('marks-panel').waitFor();
    await page.getByRole('button', { name: 'Add a mark' }).click();
    const form = page.getByTestId('mark-form');
    await form.getByLabel('Kind', { exact: true }).selectOption('mains');
    await form.getByLabel('Frequency', { exact: true }).fill('50');
    await form.getByLabel('Text', { exact: true }).fill(MAINS_TEXT);
    await form.getByRole('button', { name: 'Add mark' }).click();
    await page.getByTestId('mark-item').filter({ hasText: MAINS_TEXT }).waitFor();

    // a band mark, and a place outside the spectrum refused with the band named beside the field
    await page.getByRole('button', { name: 'Add a mark' }).click();
    await form.getByLabel('Kind', { exact: true }).selectOption('servo-bump');
    await form.getByText('a band').click();
    await form.getByLabel('From', { exact: true }).fill('9000');
    await form.getByLabel('To', { exact: true }).fill('900000');
    await form.getByLabel('Text', { exact: true }).fill(BAND_TEXT);
    await form.getByRole('button', { name: 'Add mark' }).click();
    await form.getByText(/above this spectrum's band/).waitFor();
    await form.getByLabel('To', { exact: true }).fill('14000');
    await form.getByRole('button', { name: 'Add mark' }).click();
    await page.getByTestId('mark-item').filter({ hasText: BAND_TEXT }).waitFor();

    // a third mark, deleted again after the confirmation
    await page.getByRole('button', { name: 'Add a mark' }).click();
    await form.getByLabel('Frequency', { exact: true }).fill('100');
    await form.getByLabel('Text', { exact: true }).fill('second harmonic of the mains?');
    await form.getByRole('button', { name: 'Add mark' }).click();
    const third = page.getByTestId('mark-item').filter({ hasText: 'second harmonic' });
    await third.waitFor();
    await third.getByRole('button', { name: /^Delete mark/ }).click();
    await third.getByRole('button', { name: /^Yes, delete mark/ }).click();
    await third.waitFor({ state: 'detached' });

    // the capture's comment thread
    await page.getByLabel('Add a comment').fill(COMMENT_TEXT);
    await page.getByRole('button', { name: 'Post comment' }).click();
    await page.getByTestId('comment').filter({ hasText: COMMENT_TEXT }).waitFor();

    const plot = page.getByTestId('spectrum-plot');
    await expect.poll(() => plot.locator('[data-layer="mark"]').count()).toBe(2);
    expect(await plot.locator('svg').first().textContent()).toContain(`1 ${MAINS_TEXT.slice(0, 24)}`);
    await page.evaluate(() => document.fonts.ready);
    mkdirSync(screenshotDir, { recursive: true });
    await page.screenshot({ path: path.join(screenshotDir, 'report-01-spectrum-with-marks.png'), fullPage: true });
  }, 60_000);

  it('"Print report" opens the report with figures, plot, marks and provenance, without the site navigation', async () => {
    const { page } = browser;
    await page.getByTestId('print-report').click();
    await page.waitForURL(/\/spectra\/[a-z2-7]{24}\/report$/);
    const report = page.getByTestId('spectrum-report');
    await report.waitFor();
    await report.getByTestId('spectrum-plot').locator('svg').first().waitFor();
    await page.evaluate(() => document.fonts.ready);
    expect(await page.getByRole('navigation').count()).toBe(0);
    expect(await report.getByTestId('report-mark').count()).toBe(2);
    expect(await report.locator('[data-layer="mark"]').count()).toBe(2);
  });

  it('prints to an A4 PDF whose text has the figures with units, the marks, the provenance and the caution', async () => {
    const { page } = browser;
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: path.join(screenshotDir, 'report-02-print-media.png'), fullPage: true });
    pdf = await page.pdf({ format: 'A4', printBackground: true, preferCSSPageSize: true });
    await page.emulateMedia({ media: 'screen' });
    writeFileSync(path.join(screenshotDir, 'report.pdf'), pdf);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');

    const read = pdfText(pdf);
    pdfPages = read.pages;
    pdfTextAll = read.text;
    writeFileSync(path.join(screenshotDir, 'report-pdf-text.txt'), pdfTextAll);
    const text = bare(pdfTextAll);
    const has = (s: string) => expect(text, `the PDF text lacks “${s}”`).toContain(bare(s));

    // the figures, as the API gives them, in the units the page prints
    has('Intrinsic linewidth');
    has(formatSI(analysis.intrinsicLinewidthHz!, 'Hz').text);
    has('Integrated linewidth (β-separation line)');
    has(formatSI(analysis.betaLinewidthHz!, 'Hz').text);
    has('Lineshape FWHM');
    if (analysis.lineshapeFwhmHz !== null) has(formatSI(analysis.lineshapeFwhmHz, 'Hz').text);
    has(formatScientific(analysis.whiteFloorHz2PerHz!, 'Hz²/Hz', 3).text);
    has(`${analysis.result!.settings.segment.toLocaleString('en-GB')}-sample segments`);
    // the plot's axis titles are text in the PDF too
    has('offset frequency f (Hz)');
    // the marks
    has(MAINS_TEXT);
    has(BAND_TEXT);
    has('50.00 Hz');
    has('9.00 kHz – 14.0 kHz');
    // provenance
    has(FILE_NAME);
    has(sha256);
    has('500.000 kHz');
    has('drive current 120 mA · temperature 30 °C · output power 8 mW');
    const pkg = JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { name: string; version: string };
    has(`${pkg.name} ${pkg.version}`);
    // the caution at the foot
    has('IEC 60825-1');
    // the figure is not broken across pages: its legend, axis title and caption share one page
    const pageOf = (s: string) => pdfTextAll.split('\f').findIndex((pageText) => bare(pageText).includes(bare(s)));
    expect(pageOf('offset frequency f (Hz)')).toBeGreaterThanOrEqual(0);
    expect(pageOf('β-separation line')).toBe(pageOf('offset frequency f (Hz)'));
    expect(pageOf('numbered lines and bands')).toBe(pageOf('offset frequency f (Hz)'));
    // the caution closes the report, on its last page
    expect(pageOf('IEC 60825-1')).toBe(pdfPages - 1);
    // nothing of the screen-only bar
    expect(text).not.toContain(bare('Back to the spectrum'));
    expect(pdfPages).toBeGreaterThanOrEqual(1);
    expect(pdfPages).toBeLessThanOrEqual(3);
  });

  it('an overlay of two spectra prints with both traces’ figures, the marks and each file’s provenance', async () => {
    const { page } = browser;
    // a second spectrum: the Heron fibre laser's beat note (the WAV states its own sample rate)
    const lasers = await inPage<{ lasers: { id: string; name: string }[] }>('GET', `/api/benches/${benchId}/lasers`);
    const heronId = lasers.body.lasers.find((l) => l.name === 'Heron FL-1560')!.id;
    const res = await page.request.post(url(`/api/benches/${benchId}/captures`), {
      headers: { Origin: server.baseUrl },
      multipart: {
        file: { name: HERON_FILE, mimeType: 'audio/wav', buffer: readFileSync(path.join(projectRoot, 'samples', HERON_FILE)) },
        kind: 'beat',
        laserId: heronId,
        setup: 'heterodyne',
        driveCurrentMa: '400',
      },
    });
    expect(res.status(), await res.text()).toBe(201);
    const heron = (await res.json()) as { capture: { id: string; sha256: string }; analysis: { id: string } };
    let heronAnalysis: AnalysisJson | undefined;
    const end = Date.now() + 120_000;
    while (!heronAnalysis) {
      const a = await inPage<AnalysisJson>('GET', `/api/analyses/${heron.analysis.id}`);
      if (a.body.status === 'done' || a.body.status === 'failed') heronAnalysis = a.body;
      else if (Date.now() > end) throw new Error(`analysis still ${a.body.status}`);
      else await page.waitForTimeout(300);
    }
    expect(heronAnalysis.status).toBe('done');
    const mark = await inPage('POST', `/api/captures/${heron.capture.id}/marks`, { kind: 'relaxation-oscillation', text: HERON_MARK, bandHz: [7000, 10_000] });
    expect(mark.status).toBe(201);
    const created = await inPage<{ overlay: { id: string } }>('POST', `/api/benches/${benchId}/overlays`, {
      name: OVERLAY_NAME,
      analysisIds: [analysis.id, heronAnalysis.id],
    });
    expect(created.status).toBe(201);

    await page.goto(url(`/benches/${benchId}/overlays/${created.body.overlay.id}/report`));
    const report = page.getByTestId('overlay-report');
    await report.waitFor();
    await report.locator('svg').first().waitFor();
    await page.evaluate(() => document.fonts.ready);
    expect(await report.getByTestId('report-mark').count()).toBe(3);
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: path.join(screenshotDir, 'report-03-overlay-print-media.png'), fullPage: true });
    const overlayPdf = await page.pdf({ format: 'A4', printBackground: true, preferCSSPageSize: true });
    await page.emulateMedia({ media: 'screen' });
    writeFileSync(path.join(screenshotDir, 'report-overlay.pdf'), overlayPdf);
    const read = pdfText(overlayPdf);
    writeFileSync(path.join(screenshotDir, 'report-overlay-pdf-text.txt'), read.text);
    const text = bare(read.text);
    const has = (s: string) => expect(text, `the overlay PDF text lacks “${s}”`).toContain(bare(s));
    has(OVERLAY_NAME);
    has(FILE_NAME);
    has(HERON_FILE);
    has(sha256);
    has(heron.capture.sha256);
    has(formatSI(analysis.intrinsicLinewidthHz!, 'Hz').text);
    has(formatSI(heronAnalysis.intrinsicLinewidthHz!, 'Hz').text);
    has(formatSI(heronAnalysis.betaLinewidthHz!, 'Hz').text);
    has(MAINS_TEXT);
    has(HERON_MARK);
    has('IEC 60825-1');
    const pkg = JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { name: string; version: string };
    has(`${pkg.name} ${pkg.version}`);
    expect(text).not.toContain(bare('Back to the overlay'));
  }, 180_000);

  it('the page logged no errors', () => {
    expect(consoleErrors).toEqual([]);
  });
});
