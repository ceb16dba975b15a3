/**
 * Storage: where capture files and full analysis series live, behind one small interface so that a
 * local disk (now) and an S3-compatible store (later) are interchangeable. Keys are made by the
 * server (`captures/<benchId>/<captureId>`, `series/<analysisId>.f64`, `tmp/<random>`), never taken
 * from user input; `assertStorageKey` refuses anything else.
 */
import type { Readable } from 'node:stream';

export interface StoredObject {
  sizeBytes: number;
}

/** A serialisable description of a store, so a worker thread can open the same one. */
export type StorageConfig = { driver: 'local'; root: string };

export interface Storage {
  readonly config: StorageConfig;
  /** Writes the whole stream under `key` (replacing what was there). Nothing is left under `key` on failure. */
  put(key: string, source: Readable | AsyncIterable<Uint8Array> | Iterable<Uint8Array>): Promise<StoredObject>;
  /** A stream of the object's bytes; rejects with a StorageNotFoundError when there is none. */
  open(key: string, options?: { highWaterMark?: number }): Promise<Readable>;
  /** Size of the object, or null when there is none. */
  stat(key: string): Promise<StoredObject | null>;
  /** Removes the object; no error when there is none. */
  delete(key: string): Promise<void>;
  /** Renames `from` to `to` (replacing `to`); rejects when `from` does not exist. */
  move(from: string, to: string): Promise<void>;
}

export class StorageNotFoundError extends Error {
  constructor(key: string) {
    super(`no stored object under '${key}'`);
    this.name = 'StorageNotFoundError';
  }
}

const KEY = /^[a-z0-9][a-z0-9._-]*(\/[a-z0-9][a-z0-9._-]*)*$/;

/** Keys are lower-case path segments of [a-z0-9._-], no leading dot, no '..', at most 255 characters. */
export function assertStorageKey(key: string): void {
  if (key.length > 255 || !KEY.test(key) || key.split('/').some((s) => s.startsWith('.'))) {
    throw new Error(`bad storage key '${key}'`);
  }
}
