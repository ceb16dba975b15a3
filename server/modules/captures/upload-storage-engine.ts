/**
 * A multer StorageEngine that streams an uploaded file into storage under a temporary key, computing
 * its sha256 and size on the way and keeping its first bytes for the quick format check — the file is
 * never held in memory. Multer's size limit truncates the stream; multer then calls `_removeFile`, so
 * the partial file goes. Keys are made here (`tmp/uploads/<random>`), never from the client's file name.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Request } from 'express';
import type { StorageEngine } from 'multer';
import type { Storage } from '../../storage/storage';

/** Bytes kept from the start of the file for the quick check (headers, first rows). */
export const HEAD_BYTES = 256 * 1024;

export interface ReceivedFile {
  tempKey: string;
  sizeBytes: number;
  sha256: string;
  /** the first HEAD_BYTES bytes (fewer for a smaller file) */
  head: Uint8Array;
  originalName: string;
}

/** Streams `source` into storage under a new temporary key, hashing and counting as it goes. */
export async function receiveIntoStorage(
  storage: Storage,
  source: Readable | AsyncIterable<Uint8Array>,
  originalName: string,
  onKey?: (key: string) => void,
): Promise<ReceivedFile> {
  const tempKey = `tmp/uploads/${randomBytes(16).toString('hex')}`;
  onKey?.(tempKey);
  const hash = createHash('sha256');
  const head = new Uint8Array(HEAD_BYTES);
  let headLength = 0;
  let sizeBytes = 0;
  async function* tap(): AsyncGenerator<Uint8Array> {
    for await (const chunk of source as AsyncIterable<Uint8Array>) {
      hash.update(chunk);
      sizeBytes += chunk.length;
      if (headLength < HEAD_BYTES) {
        const take = Math.min(HEAD_BYTES - headLength, chunk.length);
        head.set(chunk.subarray(0, take), headLength);
        headLength += take;
      }
      yield chunk;
    }
  }
  await storage.put(tempKey, tap());
  return { tempKey, sizeBytes, sha256: hash.digest('hex'), head: head.slice(0, headLength), originalName };
}

type MulterFile = Parameters<StorageEngine['_handleFile']>[1];

export function uploadStorageEngine(storage: Storage): StorageEngine {
  return {
    _handleFile(_req: Request, file: MulterFile, callback) {
      // `path` is what multer's abort cleanup looks for on files still being written.
      receiveIntoStorage(storage, file.stream, file.originalname, (key) => {
        file.path = key;
      }).then(
        (received) => callback(null, { path: received.tempKey, size: received.sizeBytes, received } as Partial<Express.Multer.File>),
        (e: unknown) => callback(e as Error),
      );
    },
    _removeFile(_req: Request, file: MulterFile & { path?: string }, callback) {
      if (!file.path) return callback(null);
      storage.delete(file.path).then(
        () => callback(null),
        (e: unknown) => callback(e as Error),
      );
    },
  };
}

/** The ReceivedFile multer stored with the request's file, if any. */
export function receivedFileOf(req: Request): ReceivedFile | undefined {
  return (req.file as (Express.Multer.File & { received?: ReceivedFile }) | undefined)?.received;
}
