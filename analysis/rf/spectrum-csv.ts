/**
 * Parser for an RF spectrum exported as delimited text: two columns, frequency and power (dBm or
 * linear). Pure: text or bytes in, typed arrays out.
 *
 * Usage:
 *   import { parseRfSpectrumCsv } from '../analysis/rf/spectrum-csv';
 *   const s = parseRfSpectrumCsv('frequency_MHz,power_dBm\n79.9,-71.2\n80.0,-40.1\n…');
 *   s.frequencyHz; s.powerMw; s.powerUnit; s.resolutionBandwidthHz; s.warnings
 *   parseRfSpectrumCsv(bytes, { powerUnit: 'mW', frequencyUnit: 'Hz' });
 *
 * Layout (our own rules, stated here): lines starting with # ! or // and empty lines are skipped. Lines
 * before the first data row whose first field is not a number are a preamble, kept as metadata
 * (key = first field, value = the rest); the last of them whose fields are all text is the column header. Data rows hold two numbers (a
 * third and later columns are ignored, with a warning). Delimiter: ',' ';' or tab (the first found in
 * the first data row; ',' is never the delimiter with decimalComma), else white space.
 * Units: the frequency unit comes from the option, else from the header (GHz, MHz, kHz, Hz), else Hz. The
 * power unit comes from the option, else from the header (dBm; dB read as dBm; mW; W), else dBm when a
 * value is negative (a linear power cannot be), else the caller must say (an error, never a guess).
 * Conversions: P[mW] = 10^(dBm/10); W × 1000. Output power is linear, mW (fits are made in linear power,
 * METHODS 4.4). RBW: a metadata key containing "rbw" or "resolution bandwidth" with a number (optionally
 * followed by Hz, kHz, MHz) gives resolutionBandwidthHz.
 * Checks: at least 3 data rows; frequencies finite and strictly increasing; powers finite; linear power >= 0.
 * Worked check: "f (MHz),P (dBm)\n1,-30\n2,-20\n3,-30" → frequencyHz [1e6, 2e6, 3e6], powerMw [1e-3, 1e-2, 1e-3].
 */

import { AnalysisInputError } from '../errors';

export type RfPowerUnit = 'dBm' | 'mW' | 'W';
export type RfFrequencyUnit = 'Hz' | 'kHz' | 'MHz' | 'GHz';

export interface RfSpectrum {
  /** increasing, Hz */
  frequencyHz: Float64Array;
  /** linear power, mW */
  powerMw: Float64Array;
}

export interface RfSpectrumCsvOptions {
  powerUnit?: RfPowerUnit;
  frequencyUnit?: RfFrequencyUnit;
  /** decimal comma ("-71,2"); the delimiter is then ';' or tab */
  decimalComma?: boolean;
  /** largest number of data rows accepted; default 1 000 000 */
  maxRows?: number;
}

export interface ParsedRfSpectrum extends RfSpectrum {
  powerUnit: RfPowerUnit;
  powerUnitFrom: 'option' | 'header' | 'negative-values';
  frequencyUnit: RfFrequencyUnit;
  frequencyUnitFrom: 'option' | 'header' | 'default';
  /** column names from the header line, if any */
  columns: string[] | null;
  /** "key,value" lines of the preamble */
  metadata: Record<string, string>;
  resolutionBandwidthHz: number | null;
  rows: number;
  warnings: string[];
}

const POWER_UNITS: readonly RfPowerUnit[] = ['dBm', 'mW', 'W'];
const FREQUENCY_SCALE: Record<RfFrequencyUnit, number> = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 };
export const RF_CSV_MAX_ROWS = 1_000_000;

function frequencyUnitIn(text: string): RfFrequencyUnit | null {
  const t = text.toLowerCase();
  if (t.includes('ghz')) return 'GHz';
  if (t.includes('mhz')) return 'MHz';
  if (t.includes('khz')) return 'kHz';
  if (t.includes('hz')) return 'Hz';
  return null;
}

function powerUnitIn(text: string): { unit: RfPowerUnit; note?: string } | null {
  const t = text.toLowerCase();
  if (t.includes('dbm')) return { unit: 'dBm' };
  if (/\bdb\b|\(db\)|_db\b/.test(t)) return { unit: 'dBm', note: 'the power column is in dB: read as dBm (only relative levels matter for widths)' };
  if (/\bmw\b|\(mw\)|_mw\b|milliwatt/.test(t)) return { unit: 'mW' };
  if (/\bw\b|\(w\)|_w\b|watt/.test(t)) return { unit: 'W' };
  return null;
}

function resolveOptions(options: RfSpectrumCsvOptions) {
  const o = options ?? {};
  if (o.powerUnit !== undefined && !POWER_UNITS.includes(o.powerUnit)) {
    throw new AnalysisInputError(`powerUnit must be one of ${POWER_UNITS.join(', ')}, got ${String(o.powerUnit)}`);
  }
  if (o.frequencyUnit !== undefined && !(o.frequencyUnit in FREQUENCY_SCALE)) {
    throw new AnalysisInputError(`frequencyUnit must be one of ${Object.keys(FREQUENCY_SCALE).join(', ')}, got ${String(o.frequencyUnit)}`);
  }
  const maxRows = o.maxRows ?? RF_CSV_MAX_ROWS;
  if (!(Number.isInteger(maxRows) && maxRows >= 3)) throw new AnalysisInputError(`maxRows must be an integer >= 3, got ${String(o.maxRows)}`);
  return { powerUnit: o.powerUnit, frequencyUnit: o.frequencyUnit, decimalComma: o.decimalComma ?? false, maxRows };
}

function toNumber(field: string, decimalComma: boolean): number {
  const t = field.trim().replace(/^"(.*)"$/, '$1');
  if (t === '') return NaN;
  // nan / inf literals are numbers that are not finite (reported as such, not as text)
  if (/^[+-]?(nan|inf|infinity)$/i.test(t)) return t.startsWith('-') ? -Infinity : Infinity;
  return Number(decimalComma ? t.replace(',', '.') : t);
}

function split(line: string, delimiter: string | null): string[] {
  return delimiter === null ? line.trim().split(/\s+/) : line.split(delimiter).map((f) => f.trim());
}

function pickDelimiter(line: string, decimalComma: boolean): string | null {
  for (const d of decimalComma ? [';', '\t'] : [',', ';', '\t']) if (line.includes(d)) return d;
  return null;
}

/** Parses the text (or UTF-8 bytes) of an RF spectrum export; see the header for the rules. */
export function parseRfSpectrumCsv(input: string | Uint8Array, options: RfSpectrumCsvOptions = {}): ParsedRfSpectrum {
  const o = resolveOptions(options);
  if (typeof input !== 'string' && !(input instanceof Uint8Array)) {
    throw new AnalysisInputError('the spectrum must be given as text or bytes');
  }
  let text = typeof input === 'string' ? input : new TextDecoder('utf-8', { fatal: false }).decode(input);
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const lines = text.split(/\r\n|\n|\r/);
  const warnings: string[] = [];
  const metadata: Record<string, string> = {};
  let header: string[] | null = null;
  let delimiter: string | null | undefined;
  const freq: number[] = [];
  const power: number[] = [];
  let extraColumns = false;

  for (let li = 0; li < lines.length; li++) {
    const line = lines[li].trim();
    if (line === '' || line.startsWith('#') || line.startsWith('!') || line.startsWith('//')) continue;
    const where = `line ${li + 1}`;
    const d = delimiter === undefined ? pickDelimiter(line, o.decimalComma) : delimiter;
    const fields = split(line, d);
    const a = toNumber(fields[0], o.decimalComma);
    if (freq.length === 0 && Number.isNaN(a)) {
      // preamble: every line is kept as metadata; the last one whose fields are all text is the header
      metadata[fields[0]] = fields.slice(1).join(' ');
      if (fields.length >= 2 && fields.every((f) => f !== '' && Number.isNaN(toNumber(f, o.decimalComma)) && !/^[\d.+-]/.test(f))) header = fields;
      continue;
    }
    if (delimiter === undefined) delimiter = d;
    if (fields.length < 2) throw new AnalysisInputError('a data row needs two columns (frequency, power)', where);
    if (fields.length > 2) extraColumns = true;
    const b = toNumber(fields[1], o.decimalComma);
    if (Number.isNaN(a) || Number.isNaN(b)) {
      throw new AnalysisInputError(`expected two numbers (frequency, power), got "${fields[0]}" and "${fields[1]}"`, where);
    }
    if (!Number.isFinite(a) || !Number.isFinite(b)) throw new AnalysisInputError('values must be finite', where);
    if (freq.length > 0 && !(a > freq[freq.length - 1])) {
      throw new AnalysisInputError(`frequencies must increase strictly, got ${freq[freq.length - 1]} then ${a}`, where);
    }
    if (freq.length >= o.maxRows) throw new AnalysisInputError(`the spectrum has more than ${o.maxRows} rows`, where);
    freq.push(a);
    power.push(b);
  }
  if (freq.length === 0) throw new AnalysisInputError('the spectrum CSV holds no data rows (two numeric columns: frequency, power)');
  if (freq.length < 3) throw new AnalysisInputError(`the spectrum needs at least 3 data rows, got ${freq.length}`);
  if (extraColumns) warnings.push('only the first two columns (frequency, power) were read');

  // units
  let frequencyUnit: RfFrequencyUnit = 'Hz';
  let frequencyUnitFrom: ParsedRfSpectrum['frequencyUnitFrom'] = 'default';
  const headerUnit = header ? frequencyUnitIn(header[0]) : null;
  if (o.frequencyUnit) {
    frequencyUnit = o.frequencyUnit;
    frequencyUnitFrom = 'option';
  } else if (headerUnit) {
    frequencyUnit = headerUnit;
    frequencyUnitFrom = 'header';
  }
  let powerUnit: RfPowerUnit;
  let powerUnitFrom: ParsedRfSpectrum['powerUnitFrom'];
  const headerPower = header && header.length > 1 ? powerUnitIn(header[1]) : null;
  if (o.powerUnit) {
    powerUnit = o.powerUnit;
    powerUnitFrom = 'option';
  } else if (headerPower) {
    powerUnit = headerPower.unit;
    powerUnitFrom = 'header';
    if (headerPower.note) warnings.push(headerPower.note);
  } else if (power.some((p) => p < 0)) {
    powerUnit = 'dBm';
    powerUnitFrom = 'negative-values';
    warnings.push('the power unit is not stated: read as dBm because some values are negative');
  } else {
    throw new AnalysisInputError('the power unit is not stated and all values are >= 0: say whether the power column is dBm, mW or W', 'option powerUnit');
  }

  const n = freq.length;
  const frequencyHz = new Float64Array(n);
  const powerMw = new Float64Array(n);
  const fScale = FREQUENCY_SCALE[frequencyUnit];
  for (let i = 0; i < n; i++) {
    frequencyHz[i] = freq[i] * fScale;
    if (powerUnit === 'dBm') powerMw[i] = Math.pow(10, power[i] / 10); // P[mW] = 10^(dBm/10)
    else {
      if (power[i] < 0) {
        throw new AnalysisInputError(`a linear power must be >= 0, got ${power[i]} ${powerUnit} (is the column in dBm?)`, `data row ${i + 1}`);
      }
      powerMw[i] = powerUnit === 'W' ? power[i] * 1e3 : power[i];
    }
  }
  if (frequencyHz.some((f) => f < 0)) warnings.push('some frequencies are negative (an offset axis?): they are kept as given');

  let rbw: number | null = null;
  for (const [key, value] of Object.entries(metadata)) {
    if (/rbw|resolution\s*bandwidth|res\s*bw/i.test(key)) {
      const m = /^\s*([+-]?\d+(?:\.\d*)?(?:e[+-]?\d+)?)\s*(ghz|mhz|khz|hz)?/i.exec(value);
      if (m) {
        const unit = frequencyUnitIn(m[2] ?? key) ?? 'Hz';
        const v = Number(m[1]) * FREQUENCY_SCALE[unit];
        if (Number.isFinite(v) && v > 0) rbw = v;
      }
    }
  }

  return {
    frequencyHz,
    powerMw,
    powerUnit,
    powerUnitFrom,
    frequencyUnit,
    frequencyUnitFrom,
    columns: header,
    metadata,
    resolutionBandwidthHz: rbw,
    rows: n,
    warnings,
  };
}
