/**
 * The arithmetic behind the spectrum plot, kept apart from the drawing so it can be tested:
 * the four views of one frequency-noise PSD, the white-floor mean over a band (and the intrinsic
 * linewidth it implies), the β-separation line and the regions where S_ν stands above it, and the
 * power-law noise model — all on the display series the page holds.
 *
 * Units: frequencies in Hz; S_ν one-sided in Hz²/Hz.
 * Views (IEEE Std 1139-2008 definitions):
 *   frequency  S_ν(f)                 Hz²/Hz
 *   phase      S_φ(f) = S_ν(f)/f²     rad²/Hz
 *   dbc        L(f) = 10·log10(S_φ/2)  dBc/Hz
 *   asd        √S_ν(f)                Hz/√Hz
 * β-separation line: β(f) = 8 ln2 · f/π² (Di Domenico, Schilt, Thomann, "Simple approach to the
 * relation between laser frequency noise and laser line shape", Appl. Opt. 49(25), 4801–4807, 2010).
 * Worked check: white S_ν = 10⁴ Hz²/Hz over a band → intrinsic linewidth π·10⁴ = 31.4 kHz, and the
 * β-line crosses it at f = π²·10⁴/(8 ln2) = 17.8 kHz.
 */
import { betaSeparation } from '../../../analysis/linewidth/beta-line';
import type { NoiseModelCoefficients } from '../../../analysis/noise/model-fit';

export type SpectrumView = 'frequency' | 'phase' | 'dbc' | 'asd';

export interface ViewInfo {
  /** the quantity as plain text, e.g. "S_ν" */
  symbol: string;
  /** the quantity's name as a reader says it */
  name: string;
  unit: string;
  /** log y axis (all views except L(f), which is already logarithmic in dB) */
  logY: boolean;
}

export const VIEW_INFO: Record<SpectrumView, ViewInfo> = {
  frequency: { symbol: 'S_ν', name: 'frequency-noise PSD', unit: 'Hz²/Hz', logY: true },
  phase: { symbol: 'S_φ', name: 'phase-noise PSD', unit: 'rad²/Hz', logY: true },
  dbc: { symbol: 'L(f)', name: 'single-sideband phase noise', unit: 'dBc/Hz', logY: false },
  asd: { symbol: '√S_ν', name: 'frequency-noise amplitude density', unit: 'Hz/√Hz', logY: true },
};

export const VIEWS: readonly SpectrumView[] = ['frequency', 'phase', 'dbc', 'asd'];

/** One S_ν value (Hz²/Hz) at f (Hz) in the given view; NaN where the view is undefined (f ≤ 0, S ≤ 0 in dB). */
export function toView(view: SpectrumView, frequencyHz: number, sNu: number): number {
  switch (view) {
    case 'frequency':
      return sNu;
    case 'phase':
      // S_φ = S_ν / f²
      return frequencyHz > 0 ? sNu / (frequencyHz * frequencyHz) : Number.NaN;
    case 'dbc': {
      // L(f) = S_φ/2, in dB
      if (!(frequencyHz > 0) || !(sNu > 0)) return Number.NaN;
      return 10 * Math.log10(sNu / (frequencyHz * frequencyHz) / 2);
    }
    case 'asd':
      return sNu >= 0 ? Math.sqrt(sNu) : Number.NaN;
  }
}

/** The inverse of `toView`: a value of the view back to S_ν (Hz²/Hz). */
export function fromView(view: SpectrumView, frequencyHz: number, value: number): number {
  switch (view) {
    case 'frequency':
      return value;
    case 'phase':
      return value * frequencyHz * frequencyHz;
    case 'dbc':
      return 2 * 10 ** (value / 10) * frequencyHz * frequencyHz;
    case 'asd':
      return value * value;
  }
}

export interface Series {
  frequencyHz: ArrayLike<number>;
  /** S_ν, Hz²/Hz */
  sNu: ArrayLike<number>;
}

/** A series in a view, keeping only points that can be drawn (f > 0, finite value, > 0 on a log axis). */
export function seriesInView(series: Series, view: SpectrumView): { f: number[]; v: number[] } {
  const f: number[] = [];
  const v: number[] = [];
  const logY = VIEW_INFO[view].logY;
  const n = Math.min(series.frequencyHz.length, series.sNu.length);
  for (let i = 0; i < n; i++) {
    const fi = series.frequencyHz[i];
    const vi = toView(view, fi, series.sNu[i]);
    if (!(fi > 0) || !Number.isFinite(vi) || (logY && !(vi > 0))) continue;
    f.push(fi);
    v.push(vi);
  }
  return { f, v };
}

export interface BandMean {
  /** mean of the linear S_ν values in the band, Hz²/Hz (NaN when no point lies in it) */
  meanHz2PerHz: number;
  /** Lorentzian FWHM π·S_ν,white, Hz */
  intrinsicLinewidthHz: number;
  pointCount: number;
}

/**
 * The white floor as the mean of the linear S_ν values with lo ≤ f ≤ hi, and the intrinsic
 * linewidth it implies. // Δν = π·S_ν,white (Lorentzian FWHM of white frequency noise)
 */
export function bandMean(series: Series, bandHz: readonly [number, number]): BandMean {
  const lo = Math.min(bandHz[0], bandHz[1]);
  const hi = Math.max(bandHz[0], bandHz[1]);
  let sum = 0;
  let count = 0;
  const n = Math.min(series.frequencyHz.length, series.sNu.length);
  for (let i = 0; i < n; i++) {
    const f = series.frequencyHz[i];
    const s = series.sNu[i];
    if (f >= lo && f <= hi && Number.isFinite(s)) {
      sum += s;
      count++;
    }
  }
  const mean = count > 0 ? sum / count : Number.NaN;
  return { meanHz2PerHz: mean, intrinsicLinewidthHz: Math.PI * mean, pointCount: count };
}

/** β(f) = 8 ln2 · f/π², Hz²/Hz. */
export { betaSeparation };

/** One stretch of the spectrum standing above the β-line: the trace on top, β(f) below, same abscissae. */
export interface AboveBetaRegion {
  frequencyHz: number[];
  sNu: number[];
  beta: number[];
}

/**
 * The stretches where S_ν > β(f), from `fromHz` (1/T₀) upwards. Crossings are interpolated as power
 * laws between neighbouring points (straight lines on log-log axes), so the filled area meets the
 * dashed β-line exactly. The first stretch starts at `fromHz` itself when S_ν is above β there.
 */
export function regionsAboveBeta(series: Series, fromHz = 0): AboveBetaRegion[] {
  const f: number[] = [];
  const s: number[] = [];
  const n = Math.min(series.frequencyHz.length, series.sNu.length);
  for (let i = 0; i < n; i++) {
    if (series.frequencyHz[i] > 0 && series.sNu[i] > 0) {
      f.push(series.frequencyHz[i]);
      s.push(series.sNu[i]);
    }
  }
  const regions: AboveBetaRegion[] = [];
  if (f.length < 2) return regions;
  // d = ln S − ln β is linear in ln f between two points when S is a power law there
  const d = f.map((fi, i) => Math.log(s[i]) - Math.log(betaSeparation(fi)));
  let current: AboveBetaRegion | null = null;
  const push = (fi: number, si: number) => {
    if (!current) current = { frequencyHz: [], sNu: [], beta: [] };
    current.frequencyHz.push(fi);
    current.sNu.push(si);
    current.beta.push(betaSeparation(fi));
  };
  const close = () => {
    if (current && current.frequencyHz.length >= 2) regions.push(current);
    current = null;
  };
  const interp = (i: number, t: number) => {
    const lf = Math.log(f[i]) + t * (Math.log(f[i + 1]) - Math.log(f[i]));
    const ls = Math.log(s[i]) + t * (Math.log(s[i + 1]) - Math.log(s[i]));
    return [Math.exp(lf), Math.exp(ls)] as const;
  };
  for (let i = 0; i < f.length; i++) {
    const inside = f[i] >= fromHz;
    if (inside && d[i] > 0) push(f[i], s[i]);
    if (i === f.length - 1) break;
    // the segment [i, i+1]: where does it start (fromHz) and where does it cross β?
    const lo = f[i];
    const hi = f[i + 1];
    if (hi <= fromHz) continue;
    const tStart = lo < fromHz ? Math.log(fromHz / lo) / Math.log(hi / lo) : 0;
    if (tStart > 0) {
      const [fs, ss] = interp(i, tStart);
      const dStart = d[i] + tStart * (d[i + 1] - d[i]);
      if (dStart > 0) push(fs, ss);
    }
    if (d[i] > 0 !== d[i + 1] > 0 && d[i] !== d[i + 1]) {
      const tCross = d[i] / (d[i] - d[i + 1]);
      if (tCross > tStart) {
        const [fc, sc] = interp(i, tCross);
        if (d[i] > 0) {
          push(fc, sc);
          close();
        } else {
          close();
          push(fc, sc);
        }
      }
    }
  }
  close();
  return regions;
}

/** S_ν(f) = a₀ + a₋₁/f + a₋₂/f² on a log grid of `points` frequencies over [lo, hi]. */
export function noiseModelCurve(
  model: NoiseModelCoefficients,
  rangeHz: readonly [number, number],
  points = 160,
): { frequencyHz: number[]; sNu: number[] } {
  const [lo, hi] = rangeHz;
  const frequencyHz: number[] = [];
  const sNu: number[] = [];
  if (!(lo > 0) || !(hi > lo) || points < 2) return { frequencyHz, sNu };
  const step = Math.log(hi / lo) / (points - 1);
  for (let i = 0; i < points; i++) {
    const f = lo * Math.exp(step * i);
    frequencyHz.push(f);
    // S_ν = a₀ + a₋₁/f + a₋₂/f² (the formula is written here so the client bundle leaves out the fitter)
    sNu.push(model.whiteHz2PerHz + model.flickerHz2 / f + model.randomWalkHz3 / (f * f));
  }
  return { frequencyHz, sNu };
}

/** Index of the point whose frequency is nearest to f on a log axis (series sorted ascending); -1 when empty. */
export function nearestIndexLog(frequencyHz: ArrayLike<number>, f: number): number {
  const n = frequencyHz.length;
  if (n === 0 || !(f > 0)) return -1;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (frequencyHz[mid] < f) lo = mid;
    else hi = mid;
  }
  const dl = Math.abs(Math.log(f / frequencyHz[lo]));
  const dh = Math.abs(Math.log(frequencyHz[hi] / f));
  return dh < dl ? hi : lo;
}

export interface SpurGroup {
  /** the highest spur of the group */
  frequencyHz: number;
  heightDb: number;
  /** spurs in the group and the frequencies they span, Hz */
  count: number;
  loHz: number;
  hiHz: number;
}

/**
 * Spurs whose frequencies lie within a factor `ratio` of their neighbour (a servo bump or a
 * relaxation peak that the finder reports as many lines) shown as one group, marked at its highest
 * spur. Groups come in ascending frequency.
 */
export function groupSpurs(spurs: readonly { frequencyHz: number; heightDb: number }[], ratio = 1.1): SpurGroup[] {
  const sorted = spurs.filter((s) => s.frequencyHz > 0).sort((a, b) => a.frequencyHz - b.frequencyHz);
  const groups: SpurGroup[] = [];
  for (const s of sorted) {
    const last = groups[groups.length - 1];
    if (last && s.frequencyHz / last.hiHz <= ratio) {
      last.count++;
      last.hiHz = s.frequencyHz;
      if (s.heightDb > last.heightDb) {
        last.heightDb = s.heightDb;
        last.frequencyHz = s.frequencyHz;
      }
    } else {
      groups.push({ frequencyHz: s.frequencyHz, heightDb: s.heightDb, count: 1, loHz: s.frequencyHz, hiHz: s.frequencyHz });
    }
  }
  return groups;
}
