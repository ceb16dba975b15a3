/**
 * NumPy .npy reader (format versions 1.0, 2.0 and 3.0), streaming.
 * Layout: the magic "\x93NUMPY", major and minor version bytes, the header length (uint16 LE in
 * version 1, uint32 LE in 2 and 3), then a Python dict literal {'descr': …, 'fortran_order': …,
 * 'shape': (…)} padded with spaces and ended by '\n', then the array data in C order.
 * Accepted: descr '<f4' '>f4' '<f8' '>f8' '<i2' '>i2' '<i4' '>i4' (real) and '<c8' '>c8' '<c16' '>c16'
 * (complex = I + iQ); shape (N,) (one channel, or I/Q when complex) or (N, 2) (I, Q columns);
 * fortran_order False. The header is parsed strictly: exactly the three keys, no other syntax.
 * Units: integers keep their counts, floats their values.
 * Memory: nothing is allocated from the header's claims; the header itself is limited to 64 KiB.
 * Errors name the header field or the byte offset: a header length over the limit or beyond the
 * file, an unknown descr, fortran order, a shape other than the above, data shorter than the
 * shape claims (at end(), with expected vs present), bytes after the data, NaN or ±Inf values.
 * Reference: NumPy Enhancement Proposal 1, "A simple file format for NumPy arrays" (NEP 1), and
 * the numpy.lib.format documentation.
 * Check: np.save of np.array([1, 2], '<f4') holds 128 bytes: a 118-byte header (v1.0) then 00 00 80 3F 00 00 00 40.
 */
import { AnalysisInputError } from '../errors';
import type { ReaderInfo, SampleBlock, StreamingReader } from '../types';
import { type ElementType, FrameDecoder, firstNonFinite } from './frame-decoder';

export const NPY_MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59]; // "\x93NUMPY"
/** the largest header we parse; numpy's own reader refuses headers over 10 000 bytes by default */
export const NPY_MAX_HEADER_BYTES = 65536;

export interface NpyHeader {
  version: string;
  descr: string;
  fortranOrder: boolean;
  shape: number[];
}

export interface NpyReaderOptions {
  /** total file size when known: lets the reader refuse a header or shape beyond the file at once */
  totalBytes?: number;
}

interface DescrInfo {
  element: ElementType;
  littleEndian: boolean;
  complex: boolean;
}

const DESCRS: Record<string, DescrInfo> = {
  '<f4': { element: 'float32', littleEndian: true, complex: false },
  '>f4': { element: 'float32', littleEndian: false, complex: false },
  '<f8': { element: 'float64', littleEndian: true, complex: false },
  '>f8': { element: 'float64', littleEndian: false, complex: false },
  '<i2': { element: 'int16', littleEndian: true, complex: false },
  '>i2': { element: 'int16', littleEndian: false, complex: false },
  '<i4': { element: 'int32', littleEndian: true, complex: false },
  '>i4': { element: 'int32', littleEndian: false, complex: false },
  '<c8': { element: 'float32', littleEndian: true, complex: true },
  '>c8': { element: 'float32', littleEndian: false, complex: true },
  '<c16': { element: 'float64', littleEndian: true, complex: true },
  '>c16': { element: 'float64', littleEndian: false, complex: true },
};

type State = 'prefix' | 'header' | 'data';

export class NpyReader implements StreamingReader {
  info: ReaderInfo | undefined;
  header: NpyHeader | undefined;
  private state: State = 'prefix';
  private readonly prefix = new Uint8Array(12);
  private prefixLength = 0;
  private prefixNeeded = 10;
  private headerBytes: Uint8Array | undefined;
  private headerFill = 0;
  private dataStart = 0;
  private decoder: FrameDecoder | undefined;
  private declaredFrames = 0;
  private dataBytesIn = 0;
  private frames = 0;
  private bytesIn = 0;

  constructor(private readonly options: NpyReaderOptions = {}) {}

  get samplesOut(): number {
    return this.frames;
  }

  push(chunk: Uint8Array): SampleBlock[] {
    let p = 0;
    const chunkStart = this.bytesIn;
    this.bytesIn += chunk.length;
    while (p < chunk.length && this.state !== 'data') {
      if (this.state === 'prefix') {
        const take = Math.min(this.prefixNeeded - this.prefixLength, chunk.length - p);
        this.prefix.set(chunk.subarray(p, p + take), this.prefixLength);
        this.prefixLength += take;
        p += take;
        this.checkMagic();
        if (this.prefixLength === this.prefixNeeded) this.readPrefix();
      } else {
        const hb = this.headerBytes!;
        const take = Math.min(hb.length - this.headerFill, chunk.length - p);
        hb.set(chunk.subarray(p, p + take), this.headerFill);
        this.headerFill += take;
        p += take;
        if (this.headerFill === hb.length) this.readHeader(hb);
      }
    }
    if (this.state !== 'data' || p >= chunk.length) return [];
    const declaredBytes = this.declaredFrames * this.decoder!.frameBytes;
    const room = declaredBytes - this.dataBytesIn;
    const data = chunk.subarray(p);
    if (data.length > room) {
      throw new AnalysisInputError(
        `the file holds more bytes than the header's shape declares (${this.declaredFrames} samples)`,
        `byte offset ${chunkStart + p + room}`,
      );
    }
    this.dataBytesIn += data.length;
    const block = this.decoder!.decode(data);
    if (!block) return [];
    const bad = this.decoder!.lastBlockNonFinite ? firstNonFinite(block) : -1;
    if (bad >= 0) {
      const frame = this.frames + bad;
      throw new AnalysisInputError(
        `NaN or Inf value in sample ${frame}`,
        `byte offset ${this.dataStart + frame * this.decoder!.frameBytes}`,
      );
    }
    this.frames += block.channels[0].length;
    return [block];
  }

  end(): SampleBlock[] {
    if (this.bytesIn === 0) throw new AnalysisInputError('the file is empty', 'byte offset 0');
    if (this.state === 'prefix') {
      throw new AnalysisInputError(
        `the file ends inside the npy preamble (${this.bytesIn} of ${this.prefixNeeded} bytes)`,
        `byte offset ${this.bytesIn}`,
      );
    }
    if (this.state === 'header') {
      throw new AnalysisInputError(
        `the file ends inside the npy header: the header length field claims ${this.headerBytes!.length} bytes, ` +
          `the file holds ${this.headerFill}`,
        "header field 'header length'",
      );
    }
    const frameBytes = this.decoder!.frameBytes;
    if (this.frames < this.declaredFrames) {
      const present = this.dataBytesIn;
      throw new AnalysisInputError(
        `the file is truncated: the header's shape claims ${this.declaredFrames} samples ` +
          `(${this.declaredFrames * frameBytes} data bytes), the file holds ${Math.floor(present / frameBytes)} ` +
          `samples (${present} data bytes)`,
        "header field 'shape'",
      );
    }
    if (this.frames === 0) throw new AnalysisInputError("the array holds no samples", "header field 'shape'");
    return [];
  }

  private checkMagic(): void {
    const n = Math.min(this.prefixLength, NPY_MAGIC.length);
    for (let i = 0; i < n; i++) {
      if (this.prefix[i] !== NPY_MAGIC[i]) {
        throw new AnalysisInputError('not an npy file: the magic string \\x93NUMPY is missing', `byte offset ${i}`);
      }
    }
  }

  private readPrefix(): void {
    const major = this.prefix[6];
    const minor = this.prefix[7];
    if (this.prefixNeeded === 10) {
      if (major !== 1 && major !== 2 && major !== 3) {
        throw new AnalysisInputError(
          `unsupported npy format version ${major}.${minor} (1.0, 2.0 and 3.0 are read)`,
          "header field 'version' at byte offset 6",
        );
      }
      if (major >= 2) {
        this.prefixNeeded = 12; // uint32 header length
        return;
      }
    }
    const dv = new DataView(this.prefix.buffer);
    const headerLength = major === 1 ? dv.getUint16(8, true) : dv.getUint32(8, true);
    const start = this.prefixNeeded;
    if (headerLength > NPY_MAX_HEADER_BYTES) {
      throw new AnalysisInputError(
        `the npy header length field claims ${headerLength} bytes; at most ${NPY_MAX_HEADER_BYTES} are accepted`,
        "header field 'header length' at byte offset 8",
      );
    }
    const total = this.options.totalBytes;
    if (total !== undefined && start + headerLength > total) {
      throw new AnalysisInputError(
        `the npy header length field claims ${headerLength} bytes, beyond the end of the ${total}-byte file`,
        "header field 'header length' at byte offset 8",
      );
    }
    if (headerLength === 0) throw new AnalysisInputError('the npy header is empty', "header field 'header length' at byte offset 8");
    this.headerBytes = new Uint8Array(headerLength);
    this.headerFill = 0;
    this.dataStart = start + headerLength;
    this.state = 'header';
  }

  private readHeader(bytes: Uint8Array): void {
    const major = this.prefix[6];
    const text = decodeHeaderText(bytes, major);
    const header = parseNpyHeader(text, `${major}.${this.prefix[7]}`);
    const d = DESCRS[header.descr];
    if (!d) {
      throw new AnalysisInputError(
        `unsupported npy descr '${header.descr}'; accepted: ${Object.keys(DESCRS).join(' ')}`,
        "header field 'descr'",
      );
    }
    if (header.fortranOrder) {
      throw new AnalysisInputError(
        'Fortran-ordered arrays are not read; save the array in C order (np.ascontiguousarray)',
        "header field 'fortran_order'",
      );
    }
    const shape = header.shape;
    let channels: 1 | 2;
    if (shape.length === 1) channels = d.complex ? 2 : 1;
    else if (shape.length === 2 && shape[1] === 2 && !d.complex) channels = 2;
    else {
      const hint = shape.length === 2 && shape[0] === 2 ? '; transpose the array to (N, 2)' : '';
      throw new AnalysisInputError(
        `unsupported npy shape (${shape.join(', ')}${shape.length === 1 ? ',' : ''}): ` +
          `expected (N,) or (N, 2)${d.complex ? ' for real data, (N,) for complex' : ''}${hint}`,
        "header field 'shape'",
      );
    }
    const declaredFrames = shape[0];
    const elementBytes = d.element === 'float64' ? 8 : d.element === 'float32' || d.element === 'int32' ? 4 : 2;
    const frameBytes = elementBytes * channels;
    if (declaredFrames * frameBytes > Number.MAX_SAFE_INTEGER) {
      throw new AnalysisInputError(`the npy shape claims an impossible size (${declaredFrames} samples)`, "header field 'shape'");
    }
    const total = this.options.totalBytes;
    if (total !== undefined && this.dataStart + declaredFrames * frameBytes > total) {
      const present = Math.max(0, total - this.dataStart);
      throw new AnalysisInputError(
        `the file is truncated: the header's shape claims ${declaredFrames} samples ` +
          `(${declaredFrames * frameBytes} data bytes), the file holds ${Math.floor(present / frameBytes)} ` +
          `samples (${present} data bytes)`,
        "header field 'shape'",
      );
    }
    this.header = header;
    this.declaredFrames = declaredFrames;
    this.decoder = new FrameDecoder({ element: d.element, littleEndian: d.littleEndian, channels });
    this.info = {
      format: 'npy',
      channelCount: channels,
      declaredSamples: declaredFrames,
      details: {
        version: header.version,
        descr: header.descr,
        fortranOrder: header.fortranOrder,
        shape: `(${shape.join(', ')}${shape.length === 1 ? ',' : ''})`,
        complex: d.complex,
        dataOffset: this.dataStart,
      },
    };
    this.state = 'data';
  }
}

function decodeHeaderText(bytes: Uint8Array, major: number): string {
  if (major === 3) {
    try {
      return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      throw new AnalysisInputError('the npy header is not valid UTF-8', 'header');
    }
  }
  let s = '';
  for (let i = 0; i < bytes.length; i++) s += String.fromCharCode(bytes[i]); // latin-1
  return s;
}

/**
 * Parses the header dict literal strictly: `{` then exactly the keys 'descr' (a string),
 * 'fortran_order' (True/False) and 'shape' (a tuple of non-negative integers), in any order,
 * separated by commas with an optional trailing comma, then `}` and only spaces and newlines.
 */
export function parseNpyHeader(text: string, version = '1.0'): NpyHeader {
  let i = 0;
  const fail = (what: string, field = 'header'): never => {
    throw new AnalysisInputError(`malformed npy header: ${what}`, field === 'header' ? `header at character ${i}` : `header field '${field}'`);
  };
  const ws = () => {
    while (i < text.length && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++;
  };
  const str = (): string => {
    const q = text[i];
    if (q !== "'" && q !== '"') fail('expected a quoted string');
    const endq = text.indexOf(q, i + 1);
    if (endq < 0) fail('unterminated string');
    const s = text.slice(i + 1, endq);
    if (s.includes('\\')) fail('escape sequences are not accepted');
    i = endq + 1;
    return s;
  };
  const values: Partial<NpyHeader> = {};
  const seen = new Set<string>();
  ws();
  if (text[i] !== '{') fail("expected '{'");
  i++;
  ws();
  while (text[i] !== '}') {
    const key = str();
    if (seen.has(key)) fail(`duplicate key '${key}'`, key);
    seen.add(key);
    ws();
    if (text[i] !== ':') fail("expected ':'");
    i++;
    ws();
    if (key === 'descr') {
      if (text[i] !== "'" && text[i] !== '"') fail('descr must be a type string such as <f4 (structured arrays are not read)', 'descr');
      values.descr = str();
    } else if (key === 'fortran_order') {
      if (text.startsWith('True', i)) {
        values.fortranOrder = true;
        i += 4;
      } else if (text.startsWith('False', i)) {
        values.fortranOrder = false;
        i += 5;
      } else fail('fortran_order must be True or False', 'fortran_order');
    } else if (key === 'shape') {
      if (text[i] !== '(') fail('shape must be a tuple', 'shape');
      i++;
      const dims: number[] = [];
      ws();
      while (text[i] !== ')') {
        const m = /^(\d+)L?/.exec(text.slice(i, i + 24));
        if (!m) fail('shape entries must be non-negative integers', 'shape');
        const n = Number(m![1]);
        if (!Number.isSafeInteger(n)) fail(`shape entry ${m![1]} is too large`, 'shape');
        dims.push(n);
        i += m![0].length;
        ws();
        if (text[i] === ',') {
          i++;
          ws();
        } else if (text[i] !== ')') fail("expected ',' or ')' in shape", 'shape');
      }
      i++;
      values.shape = dims;
    } else {
      fail(`unexpected key '${key}' (expected descr, fortran_order, shape)`, key);
    }
    ws();
    if (text[i] === ',') {
      i++;
      ws();
    } else if (text[i] !== '}') fail("expected ',' or '}'");
  }
  i++;
  for (let j = i; j < text.length; j++) {
    const c = text[j];
    if (c !== ' ' && c !== '\n' && c !== '\r' && c !== '\t' && c !== '\0') {
      i = j;
      fail('unexpected text after the closing brace');
    }
  }
  for (const k of ['descr', 'fortran_order', 'shape']) if (!seen.has(k)) fail(`missing key '${k}'`, k);
  return { version, descr: values.descr!, fortranOrder: values.fortranOrder!, shape: values.shape! };
}
