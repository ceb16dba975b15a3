/**
 * Decimal text -> IEEE 754 double, straight from bytes (no string per cell).
 * Grammar: [+-] digits [. digits] [(e|E) [+-] digits], at least one digit in the mantissa; with
 * `decimalComma` a ',' stands for the '.'. The literals nan, inf and infinity (any case, signed)
 * are recognised so that callers can report them as non-finite rather than non-numeric.
 * Exactness: when the digits form an integer m ≤ 2^53 and the decimal exponent e has |e| ≤ 22,
 * m·10^e (or m/10^-e) is a single correctly rounded operation, so the result equals the nearest
 * double (Clinger, "How to read floating point numbers accurately", PLDI 1990). Otherwise the text
 * goes through Number(), which rounds correctly as ECMAScript requires.
 * Check: "1.5e-3" -> 0.0015 exactly as Number("1.5e-3"); "-0,25" with decimalComma -> -0.25.
 */

export const DECIMAL_OK = 0;
export const DECIMAL_NOT_A_NUMBER = 1;
export const DECIMAL_NON_FINITE = 2;
export type DecimalStatus = typeof DECIMAL_OK | typeof DECIMAL_NOT_A_NUMBER | typeof DECIMAL_NON_FINITE;

export interface DecimalResult {
  status: DecimalStatus;
  value: number;
  /** the power of ten of the last written digit (resolution of the text): "0.0012" -> -4 */
  lastDigitExponent: number;
  /** written as a plain integer (no decimal point, no exponent): "4999" */
  plainInteger: boolean;
}

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];
const TWO53 = 9007199254740992;

function lowerIs(buf: Uint8Array, s: number, e: number, word: string): boolean {
  if (e - s !== word.length) return false;
  for (let i = 0; i < word.length; i++) if ((buf[s + i] | 0x20) !== word.charCodeAt(i)) return false;
  return true;
}

/** Parses buf[s, e) (already trimmed) into `out`. */
export function parseDecimal(buf: Uint8Array, s: number, e: number, decimalComma: boolean, out: DecimalResult): void {
  out.status = DECIMAL_NOT_A_NUMBER;
  out.value = NaN;
  out.lastDigitExponent = 0;
  out.plainInteger = false;
  let i = s;
  let negative = false;
  if (i < e && (buf[i] === 0x2b || buf[i] === 0x2d)) {
    negative = buf[i] === 0x2d;
    i++;
  }
  const point = decimalComma ? 0x2c : 0x2e;
  let mantissa = 0;
  let exact = true;
  let digits = 0;
  let fractionDigits = 0;
  let hasPoint = false;
  while (i < e) {
    const d = buf[i] - 0x30;
    if (d < 0 || d > 9) break;
    if (exact) {
      mantissa = mantissa * 10 + d;
      if (mantissa > TWO53) exact = false;
    }
    digits++;
    i++;
  }
  if (i < e && buf[i] === point) {
    hasPoint = true;
    i++;
    while (i < e) {
      const d = buf[i] - 0x30;
      if (d < 0 || d > 9) break;
      if (exact) {
        mantissa = mantissa * 10 + d;
        if (mantissa > TWO53) exact = false;
      }
      fractionDigits++;
      digits++;
      i++;
    }
  }
  if (digits === 0) {
    let t = s;
    if (t < e && (buf[t] === 0x2b || buf[t] === 0x2d)) t++;
    if (lowerIs(buf, t, e, 'nan') || lowerIs(buf, t, e, 'inf') || lowerIs(buf, t, e, 'infinity')) {
      out.status = DECIMAL_NON_FINITE;
    }
    return;
  }
  let exponent = 0;
  let hasExponent = false;
  if (i < e && (buf[i] | 0x20) === 0x65) {
    hasExponent = true;
    i++;
    let expNegative = false;
    if (i < e && (buf[i] === 0x2b || buf[i] === 0x2d)) {
      expNegative = buf[i] === 0x2d;
      i++;
    }
    let expDigits = 0;
    while (i < e) {
      const d = buf[i] - 0x30;
      if (d < 0 || d > 9) break;
      if (exponent < 100000) exponent = exponent * 10 + d;
      expDigits++;
      i++;
    }
    if (expDigits === 0) return;
    if (expNegative) exponent = -exponent;
  }
  if (i !== e) return;
  out.lastDigitExponent = exponent - fractionDigits;
  out.plainInteger = !hasPoint && !hasExponent;
  let value: number;
  const scale = exponent - fractionDigits;
  if (exact && scale >= -22 && scale <= 22) {
    // Clinger's fast path: one correctly rounded multiply or divide
    value = scale >= 0 ? mantissa * POW10[scale] : mantissa / POW10[-scale];
    if (negative) value = -value;
  } else {
    // correctly rounded by ECMAScript's StringToNumber; the syntax was checked above
    let text = String.fromCharCode.apply(null, buf.subarray(s, e) as unknown as number[]);
    if (decimalComma) text = text.replace(',', '.');
    value = Number(text);
  }
  out.value = value;
  out.status = Number.isFinite(value) ? DECIMAL_OK : DECIMAL_NON_FINITE;
}
