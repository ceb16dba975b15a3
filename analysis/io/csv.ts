/**
 * CSV/TSV reader, streaming, straight from bytes.
 * Accepted text: UTF-8 (a byte-order mark is skipped); lines end in LF or CRLF; blank lines and lines
 * starting with '#' are skipped; cells separated by tab, ';', ',' or runs of spaces — detected on the
 * first non-comment line in that order of preference; cells may be wrapped in double quotes; with ';'
 * or tab or spaces as separator a decimal comma is accepted when the first data row uses one.
 * An optional header row (any cell of the first line that is not a number makes it a header).
 * Columns: an optional time column first, then one data column (phase, frequency or beat) or two
 * (I, Q). The time column is recognised by its header name (t, time, timestamp, seconds, with or
 * without a unit such as "time (s)"), or, without a header, when there are three columns, or two
 * columns whose first one is evenly spaced over the first rows.
 * Sample rate: from the time column, fs = (K−1)/(t[K−1] − t[0]) over the first K ≤ 4096 rows; every
 * step must match 1/fs within 1e-6 relative, beyond the rounding of the printed digits — otherwise an
 * error names the row. The printing resolution is half a unit of the finest last digit written in the
 * first K time cells ("0.000333" -> 5e-7; plain integers count as exact), so times printed with a
 * fixed number of decimals pass, and exactly printed times are held to 1e-6.
 * Rows are numbered from 1 at the top of the file, header, blank and comment lines included.
 * Errors name the row (and column): a non-numeric cell, NaN or Inf, an empty cell, a row with a
 * different number of cells, uneven time steps, a line over 1 MiB, no data rows.
 * Memory: one line carried between chunks, at most 4096 rows held before the first block.
 * Common practice, no source: instruments and numpy.savetxt write columns this way.
 * Check: "t,phase\n0,0.5\n0.001,0.25\n" -> one channel [0.5, 0.25], fs = 1000 Hz, kind hint 'phase'.
 */
import { AnalysisInputError } from '../errors';
import type { CaptureKind, ReaderInfo, SampleBlock, StreamingReader } from '../types';
import { DECIMAL_NON_FINITE, DECIMAL_OK, type DecimalResult, parseDecimal } from './decimal';

export const CSV_PROBE_ROWS = 4096;
export const CSV_MAX_LINE_BYTES = 1 << 20;
/** relative spacing tolerance of the time column */
export const CSV_TIME_JITTER = 1e-6;

const TAB = 0x09;
const LF = 0x0a;
const CR = 0x0d;
const SPACE = 0x20;
const QUOTE = 0x22;
const HASH = 0x23;
const COMMA = 0x2c;
const SEMICOLON = 0x3b;
/** 0 stands for "runs of spaces or tabs" */
type Delimiter = typeof TAB | typeof COMMA | typeof SEMICOLON | 0;

const DELIMITER_NAMES: Record<number, string> = { [TAB]: 'tab', [COMMA]: 'comma', [SEMICOLON]: 'semicolon', 0: 'whitespace' };

const POW10_HALF: number[] = [];
for (let k = -340; k <= 308; k++) POW10_HALF[k + 340] = 0.5 * Math.pow(10, k);
/** half a unit of the last printed digit, 10^k / 2 */
const halfUnit = (k: number): number => POW10_HALF[Math.max(-340, Math.min(308, k)) + 340];
/** lastDigitExponent stored for a plain integer cell: exact */
const EXACT = -1000;

const TIME_NAMES = new Set(['t', 'time', 'times', 'timestamp', 'seconds', 'second', 'sec', 's', 'time_s', 't_s', 'time s', 'time(s)', 'time[s]']);

/** Header name -> is it a time column? Accepts "time", "t", "Time (s)", "time [s]", "time_s". */
export function isTimeColumnName(name: string): boolean {
  const n = name.trim().toLowerCase();
  if (TIME_NAMES.has(n)) return true;
  const base = n.replace(/\s*[[(][^\])]*[\])]\s*$/, '');
  return TIME_NAMES.has(base);
}

/** Header name of a single data column -> the kind it names, if any. */
export function kindFromColumnName(name: string): CaptureKind | undefined {
  const n = name.trim().toLowerCase();
  if (/phase|phi|φ|\brad\b/.test(n)) return 'phase';
  if (/freq|\bnu\b|ν|\bhz\b|\bdf\b/.test(n)) return 'frequency';
  if (/beat|volt|\bv\b|\bmv\b|signal|amplitude|\badc\b/.test(n)) return 'beat';
  return undefined;
}

export class CsvReader implements StreamingReader {
  info: ReaderInfo | undefined;
  private carry = new Uint8Array(256);
  private carryLength = 0;
  private line = 0;
  private bytesIn = 0;
  // layout
  private delimiter: Delimiter | undefined;
  private decimalComma = false;
  private columnCount = 0;
  private names: string[] | undefined;
  private timeColumn: boolean | undefined;
  private dataRows = 0;
  // probe (rows held before the layout is final)
  private probing = true;
  private probeValues: number[][] = [];
  private probeDigits: number[] = [];
  private probeLines: number[] = [];
  // time checks
  private dt = 0;
  private prevTime = 0;
  private firstTime = 0;
  // per-row scratch
  /** allowed |step − dt| beyond 4 ulps of t: 1e-6·dt plus the printing resolution of two cells */
  private stepTolerance = 0;
  private readonly cell: DecimalResult = { status: DECIMAL_OK, value: 0, lastDigitExponent: 0, plainInteger: false };
  private rowValues = new Float64Array(4);
  private rowDigits = new Int32Array(4);
  // output of the current push
  private outA = new Float64Array(0);
  private outB = new Float64Array(0);
  private outLength = 0;
  private frames = 0;

  get samplesOut(): number {
    return this.frames;
  }

  push(chunk: Uint8Array): SampleBlock[] {
    let p = 0;
    this.bytesIn += chunk.length;
    let nl = chunk.indexOf(LF, p);
    if (nl < 0) {
      this.appendCarry(chunk, p, chunk.length);
      return this.flush();
    }
    if (this.carryLength > 0) {
      this.appendCarry(chunk, p, nl);
      this.processLine(this.carry, 0, this.carryLength);
      this.carryLength = 0;
      p = nl + 1;
      nl = chunk.indexOf(LF, p);
    }
    while (nl >= 0) {
      if (nl - p > CSV_MAX_LINE_BYTES) this.lineTooLong();
      this.processLine(chunk, p, nl);
      p = nl + 1;
      nl = chunk.indexOf(LF, p);
    }
    this.appendCarry(chunk, p, chunk.length);
    return this.flush();
  }

  end(): SampleBlock[] {
    if (this.carryLength > 0) {
      this.processLine(this.carry, 0, this.carryLength);
      this.carryLength = 0;
    }
    if (this.probing) this.finishProbe();
    const blocks = this.flush();
    if (this.frames === 0) {
      if (this.bytesIn === 0) throw new AnalysisInputError('the file is empty', 'byte offset 0');
      throw new AnalysisInputError('the file holds no data rows', `row ${this.line}`);
    }
    if (this.timeColumn && this.frames > 1 && this.info) {
      this.info.details.timeSpanS = this.prevTime - this.firstTime;
    }
    return blocks;
  }

  private appendCarry(src: Uint8Array, s: number, e: number): void {
    const n = e - s;
    if (n <= 0) return;
    const need = this.carryLength + n;
    if (need > CSV_MAX_LINE_BYTES) this.lineTooLong();
    if (need > this.carry.length) {
      const grown = new Uint8Array(Math.max(need, this.carry.length * 2));
      grown.set(this.carry.subarray(0, this.carryLength));
      this.carry = grown;
    }
    this.carry.set(src.subarray(s, e), this.carryLength);
    this.carryLength = need;
  }

  private lineTooLong(): never {
    throw new AnalysisInputError(
      `a line is longer than ${CSV_MAX_LINE_BYTES} bytes; is this really a text file?`,
      `row ${this.line + 1}`,
    );
  }

  private processLine(buf: Uint8Array, s: number, e: number): void {
    this.line++;
    // a UTF-8 byte-order mark before the first line
    if (this.line === 1 && e - s >= 3 && buf[s] === 0xef && buf[s + 1] === 0xbb && buf[s + 2] === 0xbf) s += 3;
    // trim spaces, tabs (when not the separator) and CR on both ends
    while (e > s && (buf[e - 1] === CR || buf[e - 1] === SPACE || (buf[e - 1] === TAB && this.delimiter !== TAB))) e--;
    while (s < e && (buf[s] === SPACE || buf[s] === CR)) s++;
    if (s === e || buf[s] === HASH) return;
    if (this.delimiter === undefined) {
      this.firstLine(buf, s, e);
      return;
    }
    if (this.dataRows === 0 && this.delimiter !== COMMA) {
      // decimal comma only where the comma is not the separator and the first data row uses it
      for (let i = s; i < e; i++) if (buf[i] === COMMA) this.decimalComma = true;
    }
    const n = this.parseRow(buf, s, e);
    if (n !== this.columnCount) {
      throw new AnalysisInputError(`the row has ${n} cells, the first row had ${this.columnCount}`, `row ${this.line}`);
    }
    this.dataRows++;
    if (this.probing) {
      const row: number[] = [];
      for (let c = 0; c < n; c++) row.push(this.rowValues[c]);
      this.probeValues.push(row);
      this.probeDigits.push(this.rowDigits[0]);
      this.probeLines.push(this.line);
      if (this.probeValues.length >= CSV_PROBE_ROWS) this.finishProbe();
      return;
    }
    this.acceptRow(this.rowValues, this.line);
  }

  /** The first non-comment line: choose the separator, then header or data. */
  private firstLine(buf: Uint8Array, s: number, e: number): void {
    let hasTab = false;
    let hasSemicolon = false;
    let hasComma = false;
    for (let i = s; i < e; i++) {
      const c = buf[i];
      if (c === TAB) hasTab = true;
      else if (c === SEMICOLON) hasSemicolon = true;
      else if (c === COMMA) hasComma = true;
    }
    this.delimiter = hasTab ? TAB : hasSemicolon ? SEMICOLON : hasComma ? COMMA : 0;
    const cells = this.splitText(buf, s, e);
    let header = false;
    for (const cell of cells) {
      const bytes = new TextEncoder().encode(cell);
      parseDecimal(bytes, 0, bytes.length, false, this.cell);
      if (this.cell.status !== DECIMAL_OK && this.cell.status !== DECIMAL_NON_FINITE && this.delimiter !== COMMA) {
        parseDecimal(bytes, 0, bytes.length, true, this.cell);
      }
      if (this.cell.status !== DECIMAL_OK && this.cell.status !== DECIMAL_NON_FINITE) header = true;
    }
    this.columnCount = cells.length;
    if (this.rowValues.length < cells.length) {
      this.rowValues = new Float64Array(cells.length);
      this.rowDigits = new Int32Array(cells.length);
    }
    if (header) {
      this.names = cells;
      if (cells.length > 1 && isTimeColumnName(cells[0])) this.timeColumn = true;
      else this.timeColumn = false;
    } else if (cells.length === 3) this.timeColumn = true;
    else if (cells.length === 1) this.timeColumn = false;
    const dataColumns = this.columnCount - (this.timeColumn ? 1 : 0);
    if (this.columnCount > 3 || dataColumns < 1 || (this.timeColumn !== undefined && dataColumns > 2)) {
      throw new AnalysisInputError(
        `the first row has ${this.columnCount} columns (${DELIMITER_NAMES[this.delimiter]}-separated); ` +
          'expected an optional time column, then one data column (phase, frequency or beat) or two (I, Q)',
        `row ${this.line}`,
      );
    }
    if (!header) {
      this.line--; // parse it again as a data row
      this.processLine(buf, s, e);
    }
  }

  /** Cells of a header (or first) line as strings, quotes removed. */
  private splitText(buf: Uint8Array, s: number, e: number): string[] {
    const text = new TextDecoder('utf-8').decode(buf.subarray(s, e));
    let parts: string[];
    if (this.delimiter === 0) parts = text.trim().split(/[ \t]+/);
    else parts = text.split(String.fromCharCode(this.delimiter!));
    parts = parts.map((c) => {
      const t = c.trim();
      return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1).trim() : t;
    });
    if (parts.length > 1 && parts[parts.length - 1] === '' && this.delimiter !== 0) parts.pop(); // trailing separator
    return parts;
  }

  /** Parses the cells of a data row into rowValues/rowDigits; returns the cell count. */
  private parseRow(buf: Uint8Array, s: number, e: number): number {
    const d = this.delimiter!;
    let count = 0;
    let i = s;
    while (i <= e) {
      // find the cell [cs, ce)
      let cs = i;
      let ce: number;
      if (d === 0) {
        while (cs < e && (buf[cs] === SPACE || buf[cs] === TAB)) cs++;
        if (cs >= e) break;
        ce = cs;
        while (ce < e && buf[ce] !== SPACE && buf[ce] !== TAB) ce++;
        i = ce;
      } else {
        ce = cs;
        while (ce < e && buf[ce] !== d) ce++;
        i = ce + 1;
        if (ce === e && cs === e && count > 0) break; // a trailing separator
      }
      let a = cs;
      let b = ce;
      while (a < b && (buf[a] === SPACE || buf[a] === TAB)) a++;
      while (b > a && (buf[b - 1] === SPACE || buf[b - 1] === TAB || buf[b - 1] === CR)) b--;
      if (b - a >= 2 && buf[a] === QUOTE && buf[b - 1] === QUOTE) {
        a++;
        b--;
      }
      const column = count + 1;
      if (a === b) throw new AnalysisInputError('empty cell', `row ${this.line}, column ${column}`);
      if (count >= this.rowValues.length) {
        // more cells than the first row: count them for the error message only
        count++;
        continue;
      }
      parseDecimal(buf, a, b, this.decimalComma, this.cell);
      if (this.cell.status !== DECIMAL_OK) {
        const text = new TextDecoder('utf-8').decode(buf.subarray(a, Math.min(b, a + 40)));
        if (this.cell.status === DECIMAL_NON_FINITE) {
          throw new AnalysisInputError(`NaN or Inf value '${text}'`, `row ${this.line}, column ${column}`);
        }
        throw new AnalysisInputError(`non-numeric cell '${text}'`, `row ${this.line}, column ${column}`);
      }
      this.rowValues[count] = this.cell.value;
      this.rowDigits[count] = this.cell.plainInteger ? EXACT : this.cell.lastDigitExponent;
      count++;
      if (d !== 0 && ce === e) break;
    }
    return count;
  }

  /** Ends the probe: decides the time column, the sample rate, and releases the held rows. */
  private finishProbe(): void {
    this.probing = false;
    if (this.delimiter === undefined) return; // no data at all
    const rows = this.probeValues;
    const k = rows.length;
    if (this.timeColumn === undefined) {
      // two columns, no header: time + value when the first column is evenly spaced, else I, Q
      this.timeColumn = k >= 3 && this.evenlySpaced(rows, false);
    }
    if (this.timeColumn && k >= 2) this.evenlySpaced(rows, true);
    const dataColumns = this.columnCount - (this.timeColumn ? 1 : 0);
    const first = this.timeColumn ? 1 : 0;
    const details: Record<string, string | number | boolean> = {
      delimiter: DELIMITER_NAMES[this.delimiter],
      decimalComma: this.decimalComma,
      header: this.names !== undefined,
      timeColumn: this.timeColumn,
      columns: this.names ? this.names.join(' | ') : `${this.columnCount} unnamed`,
    };
    if (this.names && dataColumns === 1) {
      const hint = kindFromColumnName(this.names[first]);
      if (hint) details.kindHint = hint;
    }
    if (dataColumns === 2) details.kindHint = 'iq';
    this.info = {
      format: 'csv',
      channelCount: dataColumns as 1 | 2,
      // 12 significant digits: far finer than the 1e-6 spacing rule, and 1/dt prints as 100000, not 99999.99999999999
      sampleRateHz: this.timeColumn && k >= 2 ? Number((1 / this.dt).toPrecision(12)) : undefined,
      details,
    };
    const values = this.rowValues;
    for (let r = 0; r < k; r++) {
      const row = rows[r];
      for (let c = 0; c < row.length; c++) values[c] = row[c];
      this.acceptRow(values, this.probeLines[r], r === 0);
    }
    this.probeValues = [];
    this.probeDigits = [];
    this.probeLines = [];
  }

  /**
   * Are the probe's first-column steps all positive and equal within tolerance? Sets dt and the
   * step tolerance; throws (naming the row) when `strict`.
   */
  private evenlySpaced(rows: number[][], strict: boolean): boolean {
    const k = rows.length;
    const dt = (rows[k - 1][0] - rows[0][0]) / (k - 1);
    let finest = Infinity;
    for (let r = 0; r < k; r++) if (this.probeDigits[r] !== EXACT) finest = Math.min(finest, this.probeDigits[r]);
    // 1e-6 relative, plus half a unit of the finest printed digit for each of the two cells
    const tolerance = CSV_TIME_JITTER * dt + (finest === Infinity ? 0 : 2 * halfUnit(finest));
    for (let r = 1; r < k; r++) {
      const t = rows[r][0];
      const step = t - rows[r - 1][0];
      if (!(step > 0) || Math.abs(step - dt) > tolerance + 4 * Number.EPSILON * Math.abs(t)) {
        if (strict) this.unevenStep(step, dt, this.probeLines[r]);
        return false;
      }
    }
    this.dt = dt;
    this.stepTolerance = tolerance;
    return true;
  }

  private unevenStep(step: number, dt: number, line: number): never {
    if (!(step > 0)) throw new AnalysisInputError(`the time column does not increase (step ${step} s)`, `row ${line}`);
    throw new AnalysisInputError(
      `the time column is not evenly spaced: the step to this row is ${step} s, expected ${dt} s ` +
        `(more than ${CSV_TIME_JITTER} relative jitter)`,
      `row ${line}`,
    );
  }

  private acceptRow(values: Float64Array, line: number, first = this.frames === 0): void {
    let c = 0;
    if (this.timeColumn) {
      const t = values[0];
      if (first) this.firstTime = t;
      else if (this.dt > 0) {
        const step = t - this.prevTime;
        if (!(Math.abs(step - this.dt) <= this.stepTolerance + 4 * Number.EPSILON * Math.abs(t))) {
          this.unevenStep(step, this.dt, line);
        }
      }
      this.prevTime = t;
      c = 1;
    }
    if (this.outLength === this.outA.length) {
      const size = Math.max(8192, this.outA.length * 2);
      const a = new Float64Array(size);
      a.set(this.outA);
      this.outA = a;
      if (this.columnCount - c === 2) {
        const b = new Float64Array(size);
        b.set(this.outB);
        this.outB = b;
      }
    }
    this.outA[this.outLength] = values[c];
    if (this.columnCount - c === 2) this.outB[this.outLength] = values[c + 1];
    this.outLength++;
    this.frames++;
  }

  private flush(): SampleBlock[] {
    if (this.outLength === 0) return [];
    const n = this.outLength;
    const two = this.info!.channelCount === 2;
    const channels = two ? [this.outA.slice(0, n), this.outB.slice(0, n)] : [this.outA.slice(0, n)];
    this.outLength = 0;
    return [{ channels }];
  }
}
