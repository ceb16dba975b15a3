import { describe, expect, it } from 'vitest';
import { CsvReader, isTimeColumnName, kindFromColumnName } from '../../analysis/io/csv';
import { DECIMAL_NON_FINITE, DECIMAL_NOT_A_NUMBER, DECIMAL_OK, type DecimalResult, parseDecimal } from '../../analysis/io/decimal';
import { type Chunking, readAll, seeded, textBytes } from './io-encoders';

const chunkings: Chunking[] = ['whole', 'bytewise', { randomSeed: 9, maxChunk: 23 }];

function read(text: string, chunking: Chunking = 'whole') {
  const reader = new CsvReader();
  const channels = readAll(reader, textBytes(text), chunking);
  return { channels, info: reader.info!, reader };
}

/** Reads the text in every chunking and checks that they agree; returns the whole-chunk result. */
function readEveryWay(text: string) {
  const first = read(text);
  for (const c of chunkings.slice(1)) {
    const other = read(text, c);
    expect(other.channels).toEqual(first.channels);
    expect(other.info.sampleRateHz).toBe(first.info.sampleRateHz);
  }
  return first;
}

describe('parseDecimal', () => {
  const out: DecimalResult = { status: DECIMAL_OK, value: 0, lastDigitExponent: 0, plainInteger: false };
  const parse = (s: string, comma = false) => {
    const b = textBytes(s);
    parseDecimal(b, 0, b.length, comma, out);
    return { ...out };
  };

  it('parseDecimal agrees with Number() on 20 000 printed doubles (shortest, exponential and fixed forms)', () => {
    const r = seeded(42);
    for (let i = 0; i < 20000; i++) {
      const v = (r() - 0.5) * Math.pow(10, Math.floor(r() * 40) - 20);
      for (const s of [String(v), v.toExponential(17), v.toExponential(Math.floor(r() * 10)), v.toFixed(Math.floor(r() * 20))]) {
        const got = parse(s);
        expect(got.status).toBe(DECIMAL_OK);
        expect(Object.is(got.value, Number(s))).toBe(true);
      }
    }
  });
  it('parseDecimal("1.5e-3") is 0.0015 with last digit exponent -4', () => {
    expect(parse('1.5e-3')).toEqual({ status: DECIMAL_OK, value: 0.0015, lastDigitExponent: -4, plainInteger: false });
  });
  it('parseDecimal("-0,25", decimalComma) is -0.25', () => {
    expect(parse('-0,25', true).value).toBe(-0.25);
  });
  it('parseDecimal reports nan, inf, -Infinity and 1e999 as non-finite', () => {
    for (const s of ['nan', 'NaN', 'inf', '-Infinity', '+INF', '1e999']) expect(parse(s).status).toBe(DECIMAL_NON_FINITE);
  });
  it('parseDecimal reports text, a lone sign, a bare exponent and hex as not a number', () => {
    for (const s of ['abc', '-', '1e', '0x10', '1.2.3', '.', '1,5']) expect(parse(s).status).toBe(DECIMAL_NOT_A_NUMBER);
  });
});

describe('CsvReader layouts', () => {
  it('new CsvReader() reads one unnamed column of exactly printed doubles', () => {
    const r = seeded(1);
    const v = Array.from({ length: 300 }, () => (r() - 0.5) * 1e4);
    const { channels, info } = readEveryWay(v.map((x) => x.toExponential(17)).join('\n') + '\n');
    expect(channels).toEqual([v]);
    expect(info.channelCount).toBe(1);
    expect(info.sampleRateHz).toBeUndefined();
    expect(info.details.header).toBe(false);
  });

  it('new CsvReader() reads two unnamed random columns as I and Q', () => {
    const r = seeded(2);
    const rows = Array.from({ length: 50 }, () => [r() - 0.5, r() - 0.5]);
    const { channels, info } = readEveryWay(rows.map((x) => x.join(',')).join('\r\n'));
    expect(info.channelCount).toBe(2);
    expect(info.details.timeColumn).toBe(false);
    expect(info.details.kindHint).toBe('iq');
    expect(channels).toEqual([rows.map((x) => x[0]), rows.map((x) => x[1])]);
  });

  it('new CsvReader() takes an evenly spaced first column of two unnamed ones as time: fs = 1/step', () => {
    const rows = Array.from({ length: 40 }, (_, i) => `${(i * 0.125).toFixed(3)}\t${Math.sin(i)}`);
    const { channels, info } = readEveryWay(rows.join('\n'));
    expect(info.details.delimiter).toBe('tab');
    expect(info.details.timeColumn).toBe(true);
    expect(info.sampleRateHz).toBe(8);
    expect(channels).toEqual([Array.from({ length: 40 }, (_, i) => Math.sin(i))]);
  });

  it('new CsvReader() reads a header "time (s);I;Q" with semicolons and decimal commas', () => {
    const text = 'time (s);I;Q\n' + Array.from({ length: 10 }, (_, i) => `${i * 2},5;${i},25;-${i},5`).join('\n');
    const { channels, info } = readEveryWay(text);
    expect(info.details.delimiter).toBe('semicolon');
    expect(info.details.decimalComma).toBe(true);
    expect(info.sampleRateHz).toBeCloseTo(0.5, 15);
    expect(channels[0]).toEqual(Array.from({ length: 10 }, (_, i) => i + 0.25));
    expect(channels[1]).toEqual(Array.from({ length: 10 }, (_, i) => -(i + 0.5)));
  });

  it('new CsvReader() reads three unnamed whitespace-separated columns as time, I, Q', () => {
    const text = Array.from({ length: 12 }, (_, i) => `  ${i * 1e-7}   ${i}  ${-i} `).join('\n');
    const { channels, info } = readEveryWay(text);
    expect(info.details.delimiter).toBe('whitespace');
    expect(info.sampleRateHz! / 1e7).toBeCloseTo(1, 12);
    expect(channels[1]).toEqual(Array.from({ length: 12 }, (_, i) => (i === 0 ? 0 : -i)));
  });

  it('new CsvReader() skips a byte-order mark, comments, blank lines and quotes, and a trailing separator', () => {
    const text = '\ufeff# Larchmere bench, Kestrel ECL-1550\n"t","phase"\n\n0,"0.5",\n# note\n0.001,0.25,\n0.002,0.125,\n';
    const { channels, info } = readEveryWay(text);
    expect(info.details.kindHint).toBe('phase');
    expect(info.sampleRateHz).toBeCloseTo(1000, 9);
    expect(channels).toEqual([[0.5, 0.25, 0.125]]);
  });

  it('new CsvReader() accepts time printed to limited digits (each cell exact to half a unit of its last digit)', () => {
    // fs = 3 kHz printed with 6 decimals: steps alternate 0.000333 / 0.000334
    const text = 'time,frequency\n' + Array.from({ length: 5000 }, (_, i) => `${(i / 3000).toFixed(6)},${i % 7}`).join('\n');
    const { info, channels } = read(text);
    expect(info.details.kindHint).toBe('frequency');
    expect(Math.abs(info.sampleRateHz! / 3000 - 1)).toBeLessThan(1e-6);
    expect(channels[0].length).toBe(5000);
  });

  it('new CsvReader() holds no row back when the file has fewer rows than the probe', () => {
    const reader = new CsvReader();
    expect(reader.push(textBytes('1\n2\n3\n'))).toEqual([]);
    const blocks = reader.end();
    expect(blocks[0].channels[0]).toEqual(new Float64Array([1, 2, 3]));
  });

  it('new CsvReader() emits blocks as soon as the 4096-row probe is full', () => {
    const reader = new CsvReader();
    const text = Array.from({ length: 5000 }, (_, i) => String(i)).join('\n') + '\n';
    const blocks = reader.push(textBytes(text));
    expect(blocks.reduce((n, b) => n + b.channels[0].length, 0)).toBe(5000);
  });
});

describe('isTimeColumnName and kindFromColumnName', () => {
  it('isTimeColumnName knows t, time, Time (s), time [s], time_s and not phase', () => {
    for (const n of ['t', 'time', 'Time (s)', 'time [s]', 'time_s', 'Timestamp', 'seconds']) expect(isTimeColumnName(n)).toBe(true);
    for (const n of ['phase', 'I', 'tau', 'temperature']) expect(isTimeColumnName(n)).toBe(false);
  });
  it('kindFromColumnName maps phase (rad) -> phase, freq_Hz -> frequency, beat (V) -> beat, x -> undefined', () => {
    expect(kindFromColumnName('phase (rad)')).toBe('phase');
    expect(kindFromColumnName('freq_Hz')).toBe('frequency');
    expect(kindFromColumnName('beat (V)')).toBe('beat');
    expect(kindFromColumnName('x')).toBeUndefined();
  });
});

describe('CsvReader rejects', () => {
  it('a non-numeric cell, naming row and column', () => {
    expect(() => read('t,phase\n0,1\n1,2\n2,abc\n', 'bytewise')).toThrow(/non-numeric cell 'abc' \(row 4, column 2\)/);
  });
  it('NaN, naming the row', () => {
    expect(() => read('1\n2\nNaN\n')).toThrow(/NaN or Inf value 'NaN' \(row 3, column 1\)/);
  });
  it('Inf, naming the row', () => {
    expect(() => read('# c\n1,2\n-inf,3\n')).toThrow(/NaN or Inf value '-inf' \(row 3, column 1\)/);
  });
  it('a time column with jitter above 1e-6 relative, naming the row', () => {
    const t = Array.from({ length: 20 }, (_, i) => i * 1e-3);
    t[6] += 1e-8; // 1e-5 relative to the step, far above the printing resolution of 17 digits
    const text = 'time,phase\n' + t.map((x, i) => `${x.toExponential(16)},${i}`).join('\n');
    expect(() => read(text)).toThrow(/not evenly spaced.*\(row 8\)/);
  });
  it('jitter after the probe rows, naming the row', () => {
    const text = 'time,phase\n' + Array.from({ length: 6000 }, (_, i) => `${i === 5000 ? 5000.01 : i},${i}`).join('\n');
    expect(() => read(text, { randomSeed: 1, maxChunk: 5000 })).toThrow(/not evenly spaced.*\(row 5002\)/);
  });
  it('a time column that does not increase', () => {
    expect(() => read('time,phase\n1,0\n1,1\n1,2\n')).toThrow(/\(row 3\)/);
  });
  it('a row with a different number of cells', () => {
    expect(() => read('1,2\n3,4\n5\n')).toThrow(/the row has 1 cells, the first row had 2 \(row 3\)/);
  });
  it('an empty cell', () => {
    expect(() => read('1,2\n3,,4\n')).toThrow(/empty cell \(row 2, column 2\)/);
  });
  it('four data columns', () => {
    expect(() => read('a,b,c,d\n1,2,3,4\n')).toThrow(/4 columns.*\(row 1\)/);
  });
  it('a header without data rows', () => {
    expect(() => read('time,phase\n\n')).toThrow(/no data rows/);
  });
  it('an empty file', () => {
    expect(() => read('')).toThrow(/the file is empty \(byte offset 0\)/);
  });
  it('a line longer than 1 MiB', () => {
    const long = new Uint8Array((1 << 20) + 10).fill(0x31);
    const reader = new CsvReader();
    expect(() => {
      for (let i = 0; i < long.length; i += 65536) reader.push(long.subarray(i, i + 65536));
      reader.end();
    }).toThrow(/longer than 1048576 bytes.*\(row 1\)/);
  });
});

describe('CsvReader statuses', () => {
  it('DECIMAL_NOT_A_NUMBER differs from DECIMAL_NON_FINITE', () => {
    expect(DECIMAL_NOT_A_NUMBER).not.toBe(DECIMAL_NON_FINITE);
  });
});
