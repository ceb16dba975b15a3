/**
 * Numbers with units, as the product shows them: SI prefixes (12.4 kHz), scientific notation
 * with a real times sign and superscript exponents for compound units (3.1 × 10⁴ Hz²/Hz), a
 * typographic minus, and a no-break space between number and unit. Rendering in JetBrains Mono
 * is the job of the <Quantity> component; this file only makes strings.
 *
 * SI prefixes: BIPM, "The International System of Units (SI)", 9th edition, 2019 (yocto … yotta
 * in steps of 10³). Unit conversions (λ ↔ ν) live in analysis/units.ts.
 */

const NBSP = '\u00a0';
const MINUS = '\u2212';
const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻',
};

const PREFIXES: Record<number, string> = {
  [-24]: 'y', [-21]: 'z', [-18]: 'a', [-15]: 'f', [-12]: 'p', [-9]: 'n', [-6]: 'µ', [-3]: 'm',
  0: '', 3: 'k', 6: 'M', 9: 'G', 12: 'T', 15: 'P', 18: 'E', 21: 'Z', 24: 'Y',
};

export interface FormattedQuantity {
  /** the number, with a typographic minus, e.g. "−12.4" */
  number: string;
  /** the unit with its prefix, e.g. "kHz" */
  unit: string;
  /** number + no-break space + unit */
  text: string;
}

function typographicMinus(s: string): string {
  return s.startsWith('-') ? MINUS + s.slice(1) : s;
}

function join(number: string, unit: string): FormattedQuantity {
  return { number, unit, text: unit ? `${number}${NBSP}${unit}` : number };
}

function blank(unit: string): FormattedQuantity {
  return join('—', unit);
}

/** Rounds to `significant` digits and returns the string without exponent notation. */
function toSignificant(value: number, significant: number): string {
  const s = value.toPrecision(significant);
  if (!/e/i.test(s)) return s;
  // toPrecision switches to exponent form for large/small values; fall back to a plain decimal
  const exp = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, significant - 1 - exp);
  return value.toFixed(Math.min(decimals, 100));
}

function trimZeros(s: string): string {
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

export interface SiOptions {
  /** significant digits, default 3 (12.4 kHz) */
  significant?: number;
  /** drop trailing zeros after the decimal point (default false: 1.00 kHz keeps its precision) */
  trim?: boolean;
}

/**
 * `formatSI(12_400, 'Hz')` → "12.4 kHz"; `formatSI(1.5e-6, 's')` → "1.50 µs".
 * Values outside 10⁻²⁴ … 10²⁷ keep the nearest prefix and grow digits.
 */
export function formatSI(value: number, unit: string, options: SiOptions = {}): FormattedQuantity {
  const significant = options.significant ?? 3;
  if (!Number.isInteger(significant) || significant < 1 || significant > 15) {
    throw new RangeError(`significant must be an integer from 1 to 15 (got ${significant})`);
  }
  if (!Number.isFinite(value)) return blank(unit);
  if (value === 0) return join(options.trim ? '0' : toSignificant(0, significant), unit);
  const abs = Math.abs(value);
  let exp3 = Math.floor(Math.log10(abs) / 3) * 3;
  exp3 = Math.min(24, Math.max(-24, exp3));
  let mantissa = value / 10 ** exp3;
  // rounding can carry into the next prefix: 999.96 → "1000" at 4 digits → 1.000 k
  if (Math.abs(Number(toSignificant(mantissa, significant))) >= 1000 && exp3 < 24) {
    exp3 += 3;
    mantissa = value / 10 ** exp3;
  }
  let number = toSignificant(mantissa, significant);
  if (options.trim) number = trimZeros(number);
  return join(typographicMinus(number), `${PREFIXES[exp3]}${unit}`);
}

/** `formatScientific(31_000, 'Hz²/Hz', 2)` → "3.1 × 10⁴ Hz²/Hz"; exponents 0 print the plain number. */
export function formatScientific(value: number, unit: string, significant = 2): FormattedQuantity {
  if (!Number.isInteger(significant) || significant < 1 || significant > 15) {
    throw new RangeError(`significant must be an integer from 1 to 15 (got ${significant})`);
  }
  if (!Number.isFinite(value)) return blank(unit);
  if (value === 0) return join(toSignificant(0, significant), unit);
  const [mant, expText] = value.toExponential(significant - 1).split('e');
  const exp = Number(expText);
  if (exp === 0) return join(typographicMinus(mant), unit);
  const sup = String(exp)
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
  return join(`${typographicMinus(mant)} × 10${sup}`, unit);
}

/** A fixed number of decimals, optionally trimmed: `formatFixed(1550.12, 'nm', 3, true)` → "1550.12 nm". */
export function formatFixed(value: number, unit: string, decimals: number, trim = false): FormattedQuantity {
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 20) {
    throw new RangeError(`decimals must be an integer from 0 to 20 (got ${decimals})`);
  }
  if (!Number.isFinite(value)) return blank(unit);
  let number = value.toFixed(decimals);
  if (trim) number = trimZeros(number);
  if (/^-0(\.0*)?$/.test(number)) number = number.slice(1);
  return join(typographicMinus(number), unit);
}

/**
 * A laser's nominal wavelength as shown on a bench: up to 3 decimals of a nanometre, trailing
 * zeros dropped (1550.12 nm).
 */
export function formatWavelengthNm(wavelengthNm: number | null | undefined): FormattedQuantity {
  return wavelengthNm == null ? blank('nm') : formatFixed(wavelengthNm, 'nm', 3, true);
}

/**
 * A laser's nominal optical frequency: 3 decimals of a terahertz (1 GHz), about the precision of
 * a wavelength given to 0.01 nm near 1550 nm (0.01 nm ≈ 1.25 GHz there): 193.400 THz.
 */
export function formatFrequencyThz(frequencyThz: number | null | undefined): FormattedQuantity {
  return frequencyThz == null ? blank('THz') : formatFixed(frequencyThz, 'THz', 3);
}
