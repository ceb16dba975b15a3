/**
 * Raw binary reader: headerless interleaved frames (int16, int32, float32 or float64; 1 channel, or
 * 2 channels as interleaved I,Q; little or big endian). The file says nothing about itself, so
 * dtype, channel count, byte order and sample rate come from the caller.
 * Units: integers keep their counts, floats their values. Errors: a trailing partial frame (byte
 * offset of the leftover bytes), a NaN or ±Inf value (byte offset of its frame), no samples.
 * Check: the 8 bytes 01 00 FF 7F 00 80 FF FF as int16, 2 channels, little endian -> I = [1, -32768],
 * Q = [32767, -1].
 * Common practice, no source: digitiser and SDR dumps are written this way.
 */
import { AnalysisInputError } from '../errors';
import type { ByteOrder, RawDtype, ReaderInfo, SampleBlock, StreamingReader } from '../types';
import { FrameDecoder, firstNonFinite } from './frame-decoder';

export interface RawReaderOptions {
  dtype: RawDtype;
  channels: 1 | 2;
  byteOrder: ByteOrder;
}

export class RawReader implements StreamingReader {
  readonly info: ReaderInfo;
  private readonly decoder: FrameDecoder;
  private frames = 0;
  private bytesIn = 0;

  constructor(options: RawReaderOptions) {
    this.decoder = new FrameDecoder({
      element: options.dtype,
      littleEndian: options.byteOrder === 'little',
      channels: options.channels,
    });
    this.info = {
      format: 'raw',
      channelCount: options.channels,
      details: {
        dtype: options.dtype,
        byteOrder: options.byteOrder,
        channels: options.channels,
        frameBytes: this.decoder.frameBytes,
      },
    };
  }

  get samplesOut(): number {
    return this.frames;
  }

  push(chunk: Uint8Array): SampleBlock[] {
    this.bytesIn += chunk.length;
    const block = this.decoder.decode(chunk);
    if (!block) return [];
    const bad = this.decoder.lastBlockNonFinite ? firstNonFinite(block) : -1;
    if (bad >= 0) {
      const frame = this.frames + bad;
      throw new AnalysisInputError(
        `NaN or Inf value in frame ${frame}`,
        `byte offset ${frame * this.decoder.frameBytes}`,
      );
    }
    this.frames += block.channels[0].length;
    return [block];
  }

  end(): SampleBlock[] {
    const left = this.decoder.pendingBytes;
    if (left > 0) {
      throw new AnalysisInputError(
        `the file ends with a partial frame: ${left} byte(s) left over, a frame is ${this.decoder.frameBytes} bytes ` +
          `(${this.info.details.dtype}, ${this.info.channelCount} channel(s)); check --dtype and --channels`,
        `byte offset ${this.bytesIn - left}`,
      );
    }
    if (this.bytesIn === 0) throw new AnalysisInputError('the file is empty', 'byte offset 0');
    return [];
  }
}
