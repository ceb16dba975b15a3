/**
 * RF beat spectra through the API: upload (multipart) → fits, list, read, delete, across roles; bad input
 * answered 400 with nothing stored.
 * Check values are analytic: a Lorentzian of known FWHM on a baseline (METHODS 4.4, the model the fit
 * assumes), read back within 1 % under 1 % multiplicative scatter; the −20 dB width of a Lorentzian is
 * √99 × FWHM (METHODS 4.2); a long-delay self-heterodyne beat of FWHM 2Δν gives Δν (Okoshi, Kikuchi,
 * Nakayama, Electron. Lett. 16, 630 (1980)), and τ_d·Δν < 1 is warned about.
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { RfSpectrumListResponse, RfSpectrumResponse } from '../../server/contracts/rf-spectra';
import { addMember, closeTestDb, createBench, errorOf, makeTestApp, signUp, type SignedIn } from '../helpers/api-app';

afterAll(closeTestDb);

const { app, db } = makeTestApp();

/** deterministic scatter in [−1, 1) (a 32-bit LCG, Numerical Recipes constants) */
function scatter(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 31 - 1;
  };
}

/** P(f) = B + A·(w/2)²/((f−f0)² + (w/2)²) in dBm, with relative scatter `noise`, frequency in MHz. */
function lorentzianCsv({ centerHz = 80.02e6, fwhmHz = 150e3, spanHz = 3e6, points = 601, noise = 0.01, seed = 7 } = {}): string {
  const rnd = scatter(seed);
  const lines = ['# Larchmere narrow-linewidth bench, RBW 1 kHz', 'frequency (MHz),power (dBm)'];
  for (let i = 0; i < points; i++) {
    const f = centerHz - spanHz / 2 + (spanHz * i) / (points - 1);
    const x = f - centerHz;
    const pMw = (1e-6 + 2e-3 * (fwhmHz / 2) ** 2 / (x * x + (fwhmHz / 2) ** 2)) * (1 + noise * rnd());
    lines.push(`${(f / 1e6).toFixed(6)},${(10 * Math.log10(pMw)).toFixed(6)}`);
  }
  return lines.join('\n') + '\n';
}

async function bench() {
  const owner = await signUp(app, 'owner');
  const analyst = await signUp(app, 'analyst');
  const viewer = await signUp(app, 'viewer');
  const outsider = await signUp(app, 'outsider');
  const benchId = await createBench(owner, 'RF bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  return { owner, analyst, viewer, outsider, benchId, base: `/api/benches/${benchId}/rf-spectra` };
}

function upload(who: SignedIn, base: string, csv: string, fields: Record<string, string> = { name: 'Beat A' }) {
  let req = who.agent.post(base);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', Buffer.from(csv), 'beat.csv');
}

async function storedCount(benchId: string): Promise<number> {
  const [{ n }] = await db('rf_spectra').where({ bench_id: benchId }).count({ n: '*' });
  return Number(n);
}

describe('POST /api/benches/:benchId/rf-spectra', () => {
  it('fits a Lorentzian of known FWHM (150 kHz) within 1 %, with its uncertainty, and the three shapes with residuals', async () => {
    const { owner, base, benchId } = await bench();
    const res = await upload(owner, base, lorentzianCsv());
    expect(res.status).toBe(201);
    const { rfSpectrum } = RfSpectrumResponse.parse(res.body);
    expect(rfSpectrum).toMatchObject({ benchId, name: 'Beat A', fileName: 'beat.csv', powerUnit: 'dBm', mode: 'beat', points: 601 });
    expect(rfSpectrum.resolutionBandwidthHz).toBeNull();
    const byShape = Object.fromEntries(rfSpectrum.result.fits.map((f) => [f.shape, f]));
    expect(Object.keys(byShape).sort()).toEqual(['gaussian', 'lorentzian', 'voigt']);
    const l = byShape.lorentzian;
    expect(l.error).toBeNull();
    expect(Math.abs(l.fwhmHz! / 150e3 - 1)).toBeLessThan(0.01);
    expect(l.fwhmUncertaintyHz!).toBeGreaterThan(0);
    expect(Math.abs(l.fwhmHz! - 150e3)).toBeLessThan(5 * l.fwhmUncertaintyHz!);
    expect(Math.abs(l.centerHz! - 80.02e6)).toBeLessThan(1e3);
    // the Lorentzian describes a Lorentzian better than a Gaussian does
    expect(l.residualRmsMw!).toBeLessThan(byShape.gaussian.residualRmsMw!);
    expect(['lorentzian', 'voigt']).toContain(rfSpectrum.result.bestShape);
    // −20 dB full width of a Lorentzian = √99 × FWHM (METHODS 4.2); with the baseline B = 1e-6 under A = 2e-3 the
    // level (A + B)/100 is met where A·L = (A + B)/100 − B: width = FWHM·√(A/((A + B)/100 − B) − 1) = 1.0256·√99·FWHM
    const A = 2e-3;
    const B = 1e-6;
    const expected20 = 150e3 * Math.sqrt(A / ((A + B) / 100 - B) - 1);
    expect(Math.abs(rfSpectrum.result.twentyDb!.widthHz / expected20 - 1)).toBeLessThan(0.01);
    expect(rfSpectrum.result.selfHeterodyne).toBeNull();
    // the trace (mW) and each fitted curve on its grid
    expect(rfSpectrum.trace.frequencyHz).toHaveLength(601);
    expect(rfSpectrum.trace.powerMw).toHaveLength(601);
    expect(rfSpectrum.trace.models.lorentzian).toHaveLength(601);
    expect(Math.max(...rfSpectrum.trace.models.lorentzian!)).toBeCloseTo(2e-3 + 1e-6, 4);
  });

  it('reads linear power given as powerUnit mW', async () => {
    const { owner, base } = await bench();
    const rows = ['f_Hz,p'];
    for (let i = 0; i < 401; i++) {
      const x = (i - 200) * 1e3;
      rows.push(`${80e6 + x},${1e-5 + (1e-3 * 25e3 ** 2) / (x * x + 25e3 ** 2)}`);
    }
    const res = await upload(owner, base, rows.join('\n'), { name: 'Linear', powerUnit: 'mW' });
    expect(res.status).toBe(201);
    const l = res.body.rfSpectrum.result.fits.find((f: { shape: string }) => f.shape === 'lorentzian');
    expect(Math.abs(l.fwhmHz / 50e3 - 1)).toBeLessThan(1e-6); // noise-free: exact
    expect(res.body.rfSpectrum.powerUnit).toBe('mW');
  });

  it('self-heterodyne mode: a 62.832 kHz Lorentzian beat through 50 µs gives the laser Δν = 31.416 kHz, stating the assumption', async () => {
    const { analyst, base } = await bench();
    const csv = lorentzianCsv({ fwhmHz: 2 * Math.PI * 1e4, spanHz: 1.5e6, noise: 0 });
    const res = await upload(analyst, base, csv, { name: 'DSH', mode: 'self-heterodyne', delayS: '50e-6' });
    expect(res.status).toBe(201);
    const { rfSpectrum } = RfSpectrumResponse.parse(res.body);
    expect(rfSpectrum).toMatchObject({ mode: 'self-heterodyne', delayS: 50e-6, fiberLengthM: null });
    const r = rfSpectrum.result.selfHeterodyne!.fromFit.lorentzian!;
    expect(r.laserLinewidthHz / (Math.PI * 1e4) - 1).toBeCloseTo(0, 5);
    expect(r.assumption).toMatch(/half/i);
    expect(r.delayLinewidthProduct).toBeCloseTo(50e-6 * Math.PI * 1e4, 6);
    expect(r.warnings).toEqual([]);
  });

  it('self-heterodyne mode warns when the delay is short against the coherence time (fibre 400 m: τ_d·Δν ≈ 0.06)', async () => {
    const { owner, base } = await bench();
    const csv = lorentzianCsv({ fwhmHz: 2 * Math.PI * 1e4, spanHz: 1.5e6, noise: 0 });
    const res = await upload(owner, base, csv, { name: 'DSH short', mode: 'self-heterodyne', fiberLengthM: '400' });
    expect(res.status).toBe(201);
    const r = res.body.rfSpectrum.result.selfHeterodyne.fromFit.lorentzian;
    // τ_d = L·n_g/c = 400 × 1.468 / 299792458 = 1.9587 µs
    expect(r.delayS).toBeCloseTo((400 * 1.468) / 299792458, 12);
    expect(r.warnings.join(' ')).toMatch(/delay/i);
    expect(res.body.rfSpectrum.result.warnings.join(' ')).toMatch(/self-heterodyne/);
  });

  it('answers 400 and stores nothing for an empty spectrum CSV', async () => {
    const { owner, base, benchId } = await bench();
    const res = await upload(owner, base, 'frequency (MHz),power (dBm)\n');
    expect(res.status).toBe(400);
    expect(errorOf(res)).toMatchObject({ code: 'bad_input', message: expect.stringMatching(/no data rows/) });
    expect(await storedCount(benchId)).toBe(0);
  });

  it('answers 400 naming the line of a non-numeric cell, and stores nothing', async () => {
    const { owner, base, benchId } = await bench();
    const csv = lorentzianCsv().replace(/\n80\.020000,[^\n]*\n/, '\n80.020000,n/a\n');
    const res = await upload(owner, base, csv);
    expect(res.status).toBe(400);
    // header comment on line 1, column names on line 2, the 301st data row on line 303
    expect(errorOf(res).message).toMatch(/"n\/a".*\(line 303\)/);
    expect(await storedCount(benchId)).toBe(0);
  });

  it('answers 400 when no line shape converges (a flat trace), and stores nothing', async () => {
    const { owner, base, benchId } = await bench();
    const rows = ['frequency (MHz),power (dBm)'];
    for (let i = 0; i < 200; i++) rows.push(`${(80 + i * 1e-3).toFixed(3)},-70`);
    const res = await upload(owner, base, rows.join('\n'));
    expect(res.status).toBe(400);
    expect(errorOf(res)).toMatchObject({ code: 'bad_input', message: expect.stringMatching(/^no line shape could be fitted: lorentzian: .*gaussian: .*voigt: /) });
    expect(await storedCount(benchId)).toBe(0);
  });

  it('answers 400 for bad fields: a missing name, delayS in beat mode, self-heterodyne without a delay, no file, a laser of another bench', async () => {
    const { owner, base, benchId } = await bench();
    const csv = lorentzianCsv();
    const noName = await upload(owner, base, csv, { powerUnit: 'dBm' });
    expect(noName.status).toBe(400);
    expect(errorOf(noName).details!.map((d) => d.path)).toEqual(['name']);
    const beatDelay = await upload(owner, base, csv, { name: 'x', delayS: '1e-4' });
    expect(errorOf(beatDelay).details).toEqual([{ path: 'delayS', message: "delayS applies to mode 'self-heterodyne' only" }]);
    const dshNoDelay = await upload(owner, base, csv, { name: 'x', mode: 'self-heterodyne' });
    expect(errorOf(dshNoDelay).details!.map((d) => d.path)).toEqual(['delayS']);
    const negative = await upload(owner, base, csv, { name: 'x', mode: 'self-heterodyne', delayS: '-1' });
    expect(errorOf(negative).details!.map((d) => d.path)).toEqual(['delayS']);
    const noFile = await owner.agent.post(base).field('name', 'x');
    expect(noFile.status).toBe(400);
    expect(errorOf(noFile).details!.map((d) => d.path)).toEqual(['file']);
    const otherBench = await createBench(owner, 'Other');
    const laser = await owner.agent.post(`/api/benches/${otherBench}/lasers`).send({ name: 'Kestrel ECL-1550', type: 'external-cavity', wavelengthNm: 1550.12 });
    const foreign = await upload(owner, base, csv, { name: 'x', laserId: laser.body.laser.id });
    expect(foreign.status).toBe(400);
    expect(errorOf(foreign).details).toEqual([{ path: 'laserId', message: 'no such laser on this bench' }]);
    expect(await storedCount(benchId)).toBe(0);
  });

  it('answers 400 for more rows than the 40 001 accepted, and 413 for a file over 4 MiB; nothing stored', async () => {
    const { owner, base, benchId } = await bench();
    const rows = ['frequency (MHz),power (dBm)'];
    for (let i = 0; i < 40_002; i++) rows.push(`${(80 + i * 1e-4).toFixed(4)},-60`);
    const many = await upload(owner, base, rows.join('\n'));
    expect(many.status).toBe(400);
    expect(errorOf(many).message).toMatch(/more than 40001 rows/);
    const big = await upload(owner, base, '#'.repeat(4 * 1024 * 1024 + 1));
    expect(big.status).toBe(413);
    expect(errorOf(big)).toEqual({ code: 'payload_too_large', message: 'the spectrum file is larger than the 4 MiB limit' });
    expect(await storedCount(benchId)).toBe(0);
  });

  it('links a laser of the bench', async () => {
    const { owner, base, benchId } = await bench();
    const laser = await owner.agent.post(`/api/benches/${benchId}/lasers`).send({ name: 'Wren DFB-1549', type: 'dfb', wavelengthNm: 1549.32 });
    const res = await upload(owner, base, lorentzianCsv(), { name: 'With laser', laserId: laser.body.laser.id });
    expect(res.status).toBe(201);
    expect(res.body.rfSpectrum.laserId).toBe(laser.body.laser.id);
  });
});

describe('RF spectra across roles', () => {
  it('owner and analyst upload; a viewer is refused 403 and an outsider 404, before the file is read', async () => {
    const { owner, analyst, viewer, outsider, base, benchId } = await bench();
    expect((await upload(owner, base, lorentzianCsv())).status).toBe(201);
    expect((await upload(analyst, base, lorentzianCsv())).status).toBe(201);
    const v = await upload(viewer, base, lorentzianCsv());
    expect(v.status).toBe(403);
    expect(errorOf(v).code).toBe('forbidden');
    const o = await upload(outsider, base, lorentzianCsv());
    expect(o.status).toBe(404);
    expect(await storedCount(benchId)).toBe(2);
  });

  it('every member lists and reads; an outsider gets 404 for the list and for a real id', async () => {
    const { owner, viewer, analyst, outsider, base } = await bench();
    const created = (await upload(owner, base, lorentzianCsv())).body.rfSpectrum;
    for (const who of [owner, analyst, viewer]) {
      const list = await who.agent.get(base);
      expect(list.status).toBe(200);
      const { rfSpectra } = RfSpectrumListResponse.parse(list.body);
      expect(rfSpectra.map((s) => s.id)).toEqual([created.id]);
      expect(rfSpectra[0]).not.toHaveProperty('trace');
      const one = await who.agent.get(`/api/rf-spectra/${created.id}`);
      expect(one.status).toBe(200);
      expect(one.body.rfSpectrum).toEqual(created);
    }
    expect((await outsider.agent.get(base)).status).toBe(404);
    const hidden = await outsider.agent.get(`/api/rf-spectra/${created.id}`);
    expect(hidden.status).toBe(404);
    expect(errorOf(hidden).message).toBe('no such RF spectrum, or it is not on a bench of yours');
    expect((await owner.agent.get('/api/rf-spectra/not-an-id')).status).toBe(404);
  });

  it('DELETE: the viewer 403, an analyst only their own, the owner any; an outsider 404; then 404', async () => {
    const { owner, analyst, viewer, outsider, base } = await bench();
    const byOwner = (await upload(owner, base, lorentzianCsv())).body.rfSpectrum.id;
    const byAnalyst = (await upload(analyst, base, lorentzianCsv())).body.rfSpectrum.id;
    expect((await viewer.agent.delete(`/api/rf-spectra/${byAnalyst}`)).status).toBe(403);
    expect((await outsider.agent.delete(`/api/rf-spectra/${byAnalyst}`)).status).toBe(404);
    const notTheirs = await analyst.agent.delete(`/api/rf-spectra/${byOwner}`);
    expect(notTheirs.status).toBe(403);
    expect(errorOf(notTheirs).message).toMatch(/analysts delete only the RF spectra they uploaded/);
    expect((await analyst.agent.delete(`/api/rf-spectra/${byAnalyst}`)).status).toBe(204);
    expect((await owner.agent.delete(`/api/rf-spectra/${byOwner}`)).status).toBe(204);
    expect((await owner.agent.get(`/api/rf-spectra/${byOwner}`)).status).toBe(404);
    expect((await owner.agent.get(base)).body.rfSpectra).toEqual([]);
  });

  it('needs a session: 401 without one', async () => {
    const { base } = await bench();
    const anon = await request(app).get(base);
    expect(anon.status).toBe(401);
  });
});

