/**
 * WAV (RIFF/WAVE) reader, streaming.
 * Layout: "RIFF" size "WAVE", then chunks of (4-byte id, uint32 LE size, data, a pad byte when the
 * size is odd). The 'fmt ' chunk gives the encoding, channel count, sample rate and frame size; the
 * 'data' chunk holds interleaved little-endian frames; every other chunk is skipped unread.
 * Accepted: PCM (format 1) 16, 24 or 32-bit signed integers; IEEE float (format 3) 32 or 64 bit;
 * WAVE_FORMAT_EXTENSIBLE (0xFFFE) whose sub-format GUID is PCM or IEEE float; 1 or 2 channels.
 * RF64 and big-endian RIFX files are refused.
 * Units: integers keep their counts (no scaling to full scale), floats their values; the sample
 * rate is the header's nSamplesPerSec.
 * Errors name the chunk and its byte offset: a chunk larger than the file, a data chunk before the
 * fmt chunk or not a whole number of frames, an unsupported encoding, NaN or ±Inf values, no samples.
 * Reference: Microsoft/IBM "Multimedia Programming Interface and Data Specifications 1.0" (1991),
 * and Microsoft's "Multiple channel audio data and WAVE files" (WAVE_FORMAT_EXTENSIBLE).
 * Check: a 16-bit mono PCM file at 8000 Hz has byteRate 16000 and blockAlign 2; data bytes 00 80 -> -32768.
 */
import { AnalysisInputError } from '../errors';
import type { ReaderInfo, SampleBlock, StreamingReader } from '../types';
import { type ElementType, FrameDecoder, firstNonFinite } from './frame-decoder';

export interface WavReaderOptions {
  /** total file size when known: lets the reader refuse a chunk beyond the file at once */
  totalBytes?: number;
}

export interface WavFormat {
  formatTag: number;
  encoding: 'pcm' | 'float';
  channels: 1 | 2;
  sampleRateHz: number;
  bitsPerSample: number;
  blockAlign: number;
}

/** the 12 bytes after the sub-format code in KSDATAFORMAT_SUBTYPE_PCM / _IEEE_FLOAT */
const GUID_TAIL = [0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71];
const MAX_FMT_BYTES = 1024;

type State = 'riff' | 'chunk-header' | 'fmt' | 'skip' | 'data';

const ascii = (b: Uint8Array, at: number, n: number): string => {
  let s = '';
  for (let i = 0; i < n; i++) {
    const c = b[at + i];
    s += c >= 0x20 && c < 0x7f ? String.fromCharCode(c) : '?';
  }
  return s;
};

export class WavReader implements StreamingReader {
  info: ReaderInfo | undefined;
  format: WavFormat | undefined;
  private state: State = 'riff';
  private readonly head = new Uint8Array(12);
  private headFill = 0;
  private riffSize = 0;
  private chunkId = '';
  private chunkOffset = 0;
  private chunkSize = 0;
  /** bytes still to skip or to read in the current chunk (pad byte included for skips) */
  private remaining = 0;
  private fmtBytes: Uint8Array | undefined;
  private fmtFill = 0;
  private dataSeen = false;
  private dataStart = 0;
  private decoder: FrameDecoder | undefined;
  private frames = 0;
  private bytesIn = 0;

  constructor(private readonly options: WavReaderOptions = {}) {}

  get samplesOut(): number {
    return this.frames;
  }

  push(chunk: Uint8Array): SampleBlock[] {
    const out: SampleBlock[] = [];
    let p = 0;
    const base = this.bytesIn;
    this.bytesIn += chunk.length;
    while (p < chunk.length) {
      switch (this.state) {
        case 'riff': {
          const take = Math.min(12 - this.headFill, chunk.length - p);
          this.head.set(chunk.subarray(p, p + take), this.headFill);
          this.headFill += take;
          p += take;
          this.checkRiffPrefix();
          if (this.headFill === 12) {
            this.riffSize = new DataView(this.head.buffer).getUint32(4, true);
            this.headFill = 0;
            this.state = 'chunk-header';
          }
          break;
        }
        case 'chunk-header': {
          if (this.headFill === 0) this.chunkOffset = base + p;
          const take = Math.min(8 - this.headFill, chunk.length - p);
          this.head.set(chunk.subarray(p, p + take), this.headFill);
          this.headFill += take;
          p += take;
          if (this.headFill === 8) {
            this.headFill = 0;
            this.openChunk();
          }
          break;
        }
        case 'fmt': {
          const fb = this.fmtBytes!;
          const take = Math.min(fb.length - this.fmtFill, chunk.length - p);
          fb.set(chunk.subarray(p, p + take), this.fmtFill);
          this.fmtFill += take;
          p += take;
          if (this.fmtFill === fb.length) {
            this.readFmt(fb);
            this.remaining = this.chunkSize & 1; // the pad byte
            this.state = this.remaining > 0 ? 'skip' : 'chunk-header';
          }
          break;
        }
        case 'skip': {
          const take = Math.min(this.remaining, chunk.length - p);
          this.remaining -= take;
          p += take;
          if (this.remaining === 0) this.state = 'chunk-header';
          break;
        }
        case 'data': {
          const take = Math.min(this.remaining, chunk.length - p);
          const block = this.decoder!.decode(chunk.subarray(p, p + take));
          this.remaining -= take;
          p += take;
          if (block) {
            const bad = this.decoder!.lastBlockNonFinite ? firstNonFinite(block) : -1;
            if (bad >= 0) {
              const frame = this.frames + bad;
              throw new AnalysisInputError(
                `NaN or Inf value in frame ${frame}`,
                `byte offset ${this.dataStart + frame * this.format!.blockAlign}`,
              );
            }
            this.frames += block.channels[0].length;
            out.push(block);
          }
          if (this.remaining === 0) {
            this.remaining = this.chunkSize & 1;
            this.state = this.remaining > 0 ? 'skip' : 'chunk-header';
          }
          break;
        }
      }
    }
    return out;
  }

  end(): SampleBlock[] {
    if (this.bytesIn === 0) throw new AnalysisInputError('the file is empty', 'byte offset 0');
    if (this.state === 'riff') {
      throw new AnalysisInputError('the file ends inside the RIFF header', `byte offset ${this.bytesIn}`);
    }
    const present = this.bytesIn - this.chunkOffset - 8;
    // only a missing final pad byte (odd chunk size) is tolerated at the end of the file
    const onlyPadMissing = this.state === 'skip' && this.remaining === 1 && (this.chunkSize & 1) === 1;
    if (this.state === 'data' || this.state === 'fmt' || (this.state === 'skip' && !onlyPadMissing)) {
      throw this.tooLarge(present);
    }
    if (!this.dataSeen) {
      if (this.state === 'chunk-header' && this.headFill > 0) {
        throw new AnalysisInputError('the file ends inside a chunk header before any data chunk', `byte offset ${this.chunkOffset}`);
      }
      throw new AnalysisInputError("the file has no 'data' chunk", `byte offset ${this.bytesIn}`);
    }
    // RIFF size 0 and 0xFFFFFFFF are what some streaming writers leave when they cannot seek back
    if (this.riffSize !== 0 && this.riffSize !== 0xffffffff && this.riffSize + 8 > this.bytesIn) {
      throw new AnalysisInputError(
        `chunk 'RIFF' claims ${this.riffSize} bytes, the file holds ${this.bytesIn - 8} after its header`,
        "chunk 'RIFF' at byte offset 0",
      );
    }
    if (this.frames === 0) throw new AnalysisInputError('the data chunk holds no samples', `chunk 'data' at byte offset ${this.dataStart - 8}`);
    return [];
  }

  private tooLarge(present: number): AnalysisInputError {
    return new AnalysisInputError(
      `chunk '${this.chunkId}' claims ${this.chunkSize} bytes, the file holds ${Math.max(0, present)} after its header`,
      `chunk '${this.chunkId}' at byte offset ${this.chunkOffset}`,
    );
  }

  private checkRiffPrefix(): void {
    const h = this.head;
    const n = this.headFill;
    const id = ascii(h, 0, Math.min(n, 4));
    if (n >= 4 && id !== 'RIFF') {
      if (id === 'RF64') throw new AnalysisInputError('RF64 (64-bit WAV) files are not read', "chunk 'RF64' at byte offset 0");
      if (id === 'RIFX') throw new AnalysisInputError('big-endian RIFX files are not read', "chunk 'RIFX' at byte offset 0");
      throw new AnalysisInputError("not a WAV file: it does not start with 'RIFF'", 'byte offset 0');
    }
    if (n >= 12 && ascii(h, 8, 4) !== 'WAVE') {
      throw new AnalysisInputError(`not a WAV file: the RIFF form type is '${ascii(h, 8, 4)}', not 'WAVE'`, 'byte offset 8');
    }
  }

  private openChunk(): void {
    this.chunkId = ascii(this.head, 0, 4);
    this.chunkSize = new DataView(this.head.buffer).getUint32(4, true);
    const total = this.options.totalBytes;
    if (total !== undefined && this.chunkOffset + 8 + this.chunkSize > total) {
      throw this.tooLarge(total - this.chunkOffset - 8);
    }
    const where = `chunk '${this.chunkId}' at byte offset ${this.chunkOffset}`;
    if (this.chunkId === 'fmt ') {
      if (this.format) throw new AnalysisInputError("a second 'fmt ' chunk", where);
      if (this.chunkSize < 16 || this.chunkSize > MAX_FMT_BYTES) {
        throw new AnalysisInputError(`the fmt chunk size ${this.chunkSize} is not between 16 and ${MAX_FMT_BYTES} bytes`, where);
      }
      this.fmtBytes = new Uint8Array(this.chunkSize);
      this.fmtFill = 0;
      this.state = 'fmt';
    } else if (this.chunkId === 'data') {
      if (!this.format) throw new AnalysisInputError("the 'data' chunk comes before the 'fmt ' chunk", where);
      if (this.dataSeen) throw new AnalysisInputError("a second 'data' chunk", where);
      const f = this.format;
      if (this.chunkSize % f.blockAlign !== 0) {
        throw new AnalysisInputError(
          `the data chunk size ${this.chunkSize} is not a whole number of ${f.blockAlign}-byte frames`,
          where,
        );
      }
      this.dataSeen = true;
      this.dataStart = this.chunkOffset + 8;
      this.remaining = this.chunkSize;
      this.info = {
        format: 'wav',
        channelCount: f.channels,
        sampleRateHz: f.sampleRateHz,
        declaredSamples: this.chunkSize / f.blockAlign,
        details: {
          formatTag: f.formatTag,
          encoding: f.encoding,
          bitsPerSample: f.bitsPerSample,
          channels: f.channels,
          blockAlign: f.blockAlign,
          dataOffset: this.dataStart,
        },
      };
      this.state = this.remaining > 0 ? 'data' : 'chunk-header';
    } else {
      this.remaining = this.chunkSize + (this.chunkSize & 1);
      this.state = this.remaining > 0 ? 'skip' : 'chunk-header';
    }
  }

  private readFmt(b: Uint8Array): void {
    const where = `chunk 'fmt ' at byte offset ${this.chunkOffset}`;
    const dv = new DataView(b.buffer, b.byteOffset, b.byteLength);
    const formatTag = dv.getUint16(0, true);
    const channels = dv.getUint16(2, true);
    const sampleRate = dv.getUint32(4, true);
    const blockAlign = dv.getUint16(12, true);
    const bits = dv.getUint16(14, true);
    let code = formatTag;
    if (formatTag === 0xfffe) {
      if (b.length < 40 || dv.getUint16(16, true) < 22) {
        throw new AnalysisInputError('the WAVE_FORMAT_EXTENSIBLE fmt chunk is shorter than 40 bytes', where);
      }
      code = dv.getUint32(24, true);
      for (let i = 0; i < 12; i++) {
        if (b[28 + i] !== GUID_TAIL[i]) {
          throw new AnalysisInputError('the extensible sub-format GUID is neither PCM nor IEEE float', `${where}, fmt byte ${28 + i}`);
        }
      }
    }
    let element: ElementType;
    let encoding: 'pcm' | 'float';
    if (code === 1 && (bits === 16 || bits === 24 || bits === 32)) {
      encoding = 'pcm';
      element = bits === 16 ? 'int16' : bits === 24 ? 'int24' : 'int32';
    } else if (code === 3 && (bits === 32 || bits === 64)) {
      encoding = 'float';
      element = bits === 32 ? 'float32' : 'float64';
    } else {
      throw new AnalysisInputError(
        `unsupported WAV encoding: format ${code} with ${bits} bits (PCM 16/24/32-bit and IEEE float 32/64-bit are read)`,
        where,
      );
    }
    if (channels !== 1 && channels !== 2) {
      throw new AnalysisInputError(`the WAV file has ${channels} channels; 1 (a real signal) or 2 (I, Q) are read`, where);
    }
    if (blockAlign !== (channels * bits) / 8) {
      throw new AnalysisInputError(`blockAlign ${blockAlign} does not match ${channels} channel(s) of ${bits} bits`, where);
    }
    if (sampleRate <= 0) throw new AnalysisInputError('the WAV sample rate is 0', where);
    this.format = { formatTag, encoding, channels, sampleRateHz: sampleRate, bitsPerSample: bits, blockAlign };
    this.decoder = new FrameDecoder({ element, littleEndian: true, channels });
  }
}
