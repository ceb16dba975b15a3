/**
 * Command line: analyse one capture file and print one JSON object on stdout.
 *   npm run --silent analyze -- FILE [options]        (see --help)
 * The only file in analysis/ that touches node:fs and node:process: it opens the file as a stream of
 * 1 MiB chunks and hands it to analyzeCapture (analysis/pipeline.ts), the same code the worker runs.
 * Exit status: 0 with the report on stdout; 2 for bad input or options, with exactly one line
 * "error: …" on stderr (naming the row, byte offset or header field) and nothing on stdout;
 * 1 for anything else (a defect), again one line. A progress bar goes to stderr when it is a terminal.
 */
import { createReadStream, statSync } from 'node:fs';
import process from 'node:process';
import { AnalysisInputError, isAnalysisInputError } from './errors';
import { type AnalyzeOptions, analyzeCapture } from './pipeline';
import type { ByteOrder, CaptureFormat, CaptureKind, RawDtype, WindowName } from './types';

const HELP = `Analyse a laser frequency-noise capture: S_ν by Welch, white floor, linewidths, noise model.

Usage: npm run --silent analyze -- FILE [options]

FILE is CSV/TSV text, NumPy .npy, WAV or raw binary; the format is found from the
file's first bytes, then its extension (--format overrides).

Options:
  --kind phase|iq|beat|frequency  what the samples are. Default: iq for two channels
                                  (I, Q); for one channel it is taken from a CSV column
                                  name (phase, frequency, beat) and must be given otherwise.
  --sample-rate HZ                samples per second. Default: the file's own (WAV header,
                                  CSV time column); required for npy and raw files.
  --format csv|npy|wav|raw        the file format (default: sniffed).
  --dtype int16|int32|float32|float64   raw files: element type (required for raw).
  --channels 1|2                  raw files: 2 = interleaved I,Q (default 2 with --kind iq, else 1).
  --byte-order little|big         raw files (default little).
  --window hann|blackman-harris|flat-top   Welch window (default hann).
  --segment N                     Welch segment length in samples (default: the largest power
                                  of two ≤ N/8 within 256…65536).
  --overlap F                     segment overlap fraction in [0, 1) (default 0.5).
  --observation-time S            T0 for the β-line and lineshape (default: the record length).
  --floor-band LO:HI              band in Hz for the white floor (default: found automatically).
  --series                        include the spectra (S_ν, one-sided Hz²/Hz) in the output.
  --help                          show this text.

Output: one JSON object on stdout (input, settings, whiteFloor, intrinsicLinewidthHz,
betaLine, lineshape, noiseModel, spurs, carrier, warnings[, spectrum, logSpectrum]).
Every S_ν is one-sided in Hz²/Hz. Bad input: exit status 2 and one "error: …" line on stderr.
`;

const VALUE_OPTIONS = [
  '--kind',
  '--sample-rate',
  '--format',
  '--dtype',
  '--channels',
  '--byte-order',
  '--window',
  '--segment',
  '--overlap',
  '--observation-time',
  '--floor-band',
] as const;
type ValueOption = (typeof VALUE_OPTIONS)[number];

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function usageError(message: string): never {
  throw new AnalysisInputError(message);
}

function numberArg(name: string, text: string): number {
  if (!NUMBER.test(text)) usageError(`${name} expects a number, got '${text}'`);
  return Number(text);
}

function oneOf<T extends string>(name: string, text: string, allowed: readonly T[]): T {
  if (!(allowed as readonly string[]).includes(text)) usageError(`${name} expects one of ${allowed.join(', ')}, got '${text}'`);
  return text as T;
}

export interface CliArguments {
  help: boolean;
  file?: string;
  options: AnalyzeOptions;
}

export function parseArguments(argv: string[]): CliArguments {
  const options: AnalyzeOptions = {};
  let file: string | undefined;
  let help = false;
  const seen = new Set<string>();
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--help' || arg === '-h') {
      help = true;
      continue;
    }
    if (arg === '--series') {
      options.series = true;
      continue;
    }
    if (arg.startsWith('-') && arg !== '-') {
      const eq = arg.indexOf('=');
      const name = eq > 0 ? arg.slice(0, eq) : arg;
      if (!(VALUE_OPTIONS as readonly string[]).includes(name)) usageError(`unknown option ${name} (see --help)`);
      let value: string;
      if (eq > 0) value = arg.slice(eq + 1);
      else {
        if (i + 1 >= argv.length) usageError(`${name} needs a value`);
        value = argv[++i];
      }
      if (seen.has(name)) usageError(`${name} is given twice`);
      seen.add(name);
      applyOption(options, name as ValueOption, value);
      continue;
    }
    if (file !== undefined) usageError(`one file at a time: got '${file}' and '${arg}'`);
    file = arg;
  }
  return { help, file, options };
}

function applyOption(o: AnalyzeOptions, name: ValueOption, v: string): void {
  switch (name) {
    case '--kind':
      o.kind = oneOf<CaptureKind>(name, v, ['phase', 'iq', 'beat', 'frequency']);
      break;
    case '--sample-rate':
      o.sampleRateHz = numberArg(name, v);
      break;
    case '--format':
      o.format = oneOf<CaptureFormat>(name, v, ['csv', 'npy', 'wav', 'raw']);
      break;
    case '--dtype':
      o.dtype = oneOf<RawDtype>(name, v, ['int16', 'int32', 'float32', 'float64']);
      break;
    case '--channels':
      o.channels = Number(oneOf(name, v, ['1', '2'])) as 1 | 2;
      break;
    case '--byte-order':
      o.byteOrder = oneOf<ByteOrder>(name, v, ['little', 'big']);
      break;
    case '--window':
      o.window = oneOf<WindowName>(name, v, ['hann', 'blackman-harris', 'flat-top']);
      break;
    case '--segment':
      o.segment = numberArg(name, v);
      break;
    case '--overlap':
      o.overlap = numberArg(name, v);
      break;
    case '--observation-time':
      o.observationTimeS = numberArg(name, v);
      break;
    case '--floor-band': {
      const parts = v.split(':');
      if (parts.length !== 2) usageError(`--floor-band expects LO:HI in Hz, got '${v}'`);
      o.floorBandHz = [numberArg(name, parts[0]), numberArg(name, parts[1])];
      break;
    }
  }
}

/** JSON with two-space indentation, arrays of numbers kept on one line. */
export function formatReport(value: unknown): string {
  return JSON.stringify(value, null, 2).replace(/\[\s*\n\s*([-+\d.eE,\s]*?)\s*\n\s*\]/g, (_, body: string) =>
    `[${body.replace(/\s*\n\s*/g, ' ')}]`,
  );
}

function progressBar(): (fraction: number, stage: string) => void {
  let last = '';
  return (fraction, stage) => {
    const width = 30;
    const filled = Math.round(fraction * width);
    const line = `[${'#'.repeat(filled)}${'-'.repeat(width - filled)}] ${String(Math.round(fraction * 100)).padStart(3)}% ${stage}`;
    if (line !== last) {
      process.stderr.write(`\r${line}\x1b[K`);
      last = line;
    }
  };
}

async function main(argv: string[]): Promise<number> {
  const args = parseArguments(argv);
  if (args.help) {
    process.stdout.write(HELP);
    return 0;
  }
  if (args.file === undefined) usageError('no capture file given (usage: npm run --silent analyze -- FILE [options]; see --help)');
  const file = args.file;
  let size: number;
  try {
    const st = statSync(file);
    if (!st.isFile()) usageError(`'${file}' is not a file`);
    size = st.size;
  } catch (e) {
    if (isAnalysisInputError(e)) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    usageError(`cannot read '${file}'${code === 'ENOENT' ? ': no such file' : code ? `: ${code}` : ''}`);
  }
  const tty = Boolean(process.stderr.isTTY);
  const stream = createReadStream(file, { highWaterMark: 1 << 20 });
  const fileName = file.split(/[\\/]/).pop();
  try {
    const { report } = await analyzeCapture(
      { chunks: stream as AsyncIterable<Uint8Array>, totalBytes: size },
      { ...args.options, fileName },
      tty ? progressBar() : undefined,
    );
    if (tty) process.stderr.write('\r\x1b[K');
    process.stdout.write(formatReport(report) + '\n');
    return 0;
  } finally {
    stream.destroy();
  }
}

/** option names of the analysis API -> the CLI's flags, for error messages */
const FLAGS: Record<string, string> = {
  kind: '--kind',
  format: '--format',
  sampleRateHz: '--sample-rate',
  dtype: '--dtype',
  channels: '--channels',
  byteOrder: '--byte-order',
  window: '--window',
  segment: '--segment',
  overlap: '--overlap',
  observationTimeS: '--observation-time',
  floorBandHz: '--floor-band',
};

function cliWording(message: string): string {
  return message.replace(/\boption (\w+)/g, (m, name: string) => (FLAGS[name] ? `option ${FLAGS[name]}` : m));
}

main(process.argv.slice(2)).then(
  (status) => {
    process.exitCode = status;
  },
  (e: unknown) => {
    if (process.stderr.isTTY) process.stderr.write('\r\x1b[K');
    const message = e instanceof Error ? e.message : String(e);
    const oneLine = cliWording(message.replace(/\s*\n\s*/g, ' '));
    if (isAnalysisInputError(e)) {
      process.stderr.write(`error: ${oneLine}\n`);
      process.exitCode = 2;
    } else {
      process.stderr.write(`error: internal: ${oneLine}\n`);
      process.exitCode = 1;
    }
  },
);
