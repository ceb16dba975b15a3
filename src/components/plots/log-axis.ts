/**
 * Ticks for log axes as a lab notebook draws them: a grid line at every decade, fainter lines at
 * 2…9 × 10ᵏ while the axis spans few enough decades to keep them legible, and labels thinned to
 * every n-th decade when the axis spans many. With fewer than three decades on the axis the 2 and 5
 * ticks get labels too (all minors when zoomed under a decade), so the reader always has several
 * numbers to go by.
 */
import { formatSI } from '../../lib/units';

export interface Tick {
  value: number;
  /** a decade (10ᵏ) */
  major: boolean;
  /** the label, or null for an unlabelled grid line */
  label: string | null;
}

const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻',
};

function superscript(n: number): string {
  return String(n)
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
}

/** 10⁴, 10⁻³, 2·10⁴; values from 0.01 to 999 written out (0.05, 1, 200), as they read more easily. */
export function formatPowerOfTen(value: number): string {
  if (!(value > 0)) return String(value);
  const k = Math.floor(Math.log10(value) + 1e-9);
  const m = Math.round(value / 10 ** k);
  if (k >= -2 && k <= 2) return String(Number(`${m}e${k}`));
  const decade = `10${superscript(k)}`;
  return m === 1 ? decade : `${m}·${decade}`;
}

/** "10 Hz", "1 kHz", "200 kHz": SI prefixes, no trailing zeros. */
export function formatFrequencyTick(value: number): string {
  return formatSI(value, 'Hz', { significant: 3, trim: true }).text;
}

/**
 * Ticks for a log axis over [lo, hi] (lo, hi > 0). `maxLabels` caps the labelled decades.
 */
export function logTicks(domain: readonly [number, number], maxLabels: number, format: (v: number) => string): Tick[] {
  const lo = Math.min(domain[0], domain[1]);
  const hi = Math.max(domain[0], domain[1]);
  if (!(lo > 0) || !(hi > 0) || !Number.isFinite(lo) || !Number.isFinite(hi)) return [];
  const eps = 1e-9;
  const decades = Math.log10(hi / lo);
  const kLo = Math.floor(Math.log10(lo) + eps);
  const kHi = Math.ceil(Math.log10(hi) - eps);
  const withMinor = decades <= 7;
  const majorsInRange: number[] = [];
  for (let k = kLo; k <= kHi; k++) {
    const v = Number(`1e${k}`);
    if (v >= lo * (1 - eps) && v <= hi * (1 + eps)) majorsInRange.push(k);
  }
  const step = Math.max(1, Math.ceil(majorsInRange.length / Math.max(1, maxLabels)));
  // fewer than three decades labelled: label 2 and 5 as well; none at all (zoomed under a decade): every minor
  const labelMinor = new Set<number>(
    majorsInRange.length === 0 || decades < 0.8 ? [2, 3, 4, 5, 6, 7, 8, 9] : majorsInRange.length < 3 ? [2, 5] : [],
  );
  const ticks: Tick[] = [];
  for (let k = kLo; k <= kHi; k++) {
    for (let m = 1; m <= 9; m++) {
      if (m > 1 && !withMinor) break;
      // parsed from text so 10⁻⁴ is exactly the double nearest 0.0001 (10 ** -4 is not)
      const v = Number(`${m}e${k}`);
      if (v < lo * (1 - eps) || v > hi * (1 + eps)) continue;
      const major = m === 1;
      let label: string | null = null;
      if (major && ((k % step) + step) % step === 0) label = format(v);
      else if (!major && labelMinor.has(m)) label = format(v);
      ticks.push({ value: v, major, label });
    }
  }
  return ticks;
}

/** Round linear ticks (for L(f) in dB): steps of 1, 2 or 5 × 10ᵏ, about `count` of them. */
export function linearTicks(domain: readonly [number, number], count: number, format: (v: number) => string): Tick[] {
  const lo = Math.min(domain[0], domain[1]);
  const hi = Math.max(domain[0], domain[1]);
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || hi <= lo) return [];
  const raw = (hi - lo) / Math.max(1, count);
  const k = Math.floor(Math.log10(raw));
  const base = 10 ** k;
  // the nearest of 1, 2, 5, 10 × 10ᵏ in ratio (thresholds at √2, √10, √50)
  const r = raw / base;
  const step = (r >= Math.sqrt(50) ? 10 : r >= Math.sqrt(10) ? 5 : r >= Math.SQRT2 ? 2 : 1) * base;
  const ticks: Tick[] = [];
  const first = Math.ceil(lo / step - 1e-9);
  const last = Math.floor(hi / step + 1e-9);
  for (let i = first; i <= last; i++) {
    const v = Number((i * step).toPrecision(12));
    ticks.push({ value: v, major: true, label: format(v) });
  }
  return ticks;
}
