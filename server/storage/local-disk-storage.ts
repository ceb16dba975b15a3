/**
 * Storage on the local disk under one root folder (env.storageDir). A key maps to a file path below
 * the root. `put` writes to a hidden sibling and renames it into place when the stream has ended, so
 * a key never shows a half-written file; `move` is a rename (same file system, atomic).
 */
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { assertStorageKey, StorageNotFoundError, type Storage, type StorageConfig, type StoredObject } from './storage';

export class LocalDiskStorage implements Storage {
  readonly config: StorageConfig;

  constructor(readonly root: string) {
    this.config = { driver: 'local', root };
  }

  /** The file behind a key (for logs and tests; callers use the interface). */
  pathOf(key: string): string {
    assertStorageKey(key);
    return path.join(this.root, ...key.split('/'));
  }

  async put(key: string, source: Readable | AsyncIterable<Uint8Array> | Iterable<Uint8Array>): Promise<StoredObject> {
    const target = this.pathOf(key);
    await mkdir(path.dirname(target), { recursive: true });
    const partial = path.join(path.dirname(target), `.partial-${randomBytes(8).toString('hex')}`);
    let sizeBytes = 0;
    try {
      const readable = source instanceof Readable ? source : Readable.from(source, { objectMode: false });
      const count = new Transform({
        transform(chunk: Buffer, _encoding, callback) {
          sizeBytes += chunk.length;
          callback(null, chunk);
        },
      });
      await pipeline(readable, count, createWriteStream(partial, { highWaterMark: 1 << 20 }));
      await rename(partial, target);
    } catch (e) {
      await rm(partial, { force: true });
      throw e;
    }
    return { sizeBytes };
  }

  async open(key: string, options: { highWaterMark?: number } = {}): Promise<Readable> {
    const file = this.pathOf(key);
    try {
      await stat(file);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'ENOENT') throw new StorageNotFoundError(key);
      throw e;
    }
    return createReadStream(file, { highWaterMark: options.highWaterMark ?? 1 << 20 });
  }

  async stat(key: string): Promise<StoredObject | null> {
    try {
      const s = await stat(this.pathOf(key));
      return s.isFile() ? { sizeBytes: s.size } : null;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw e;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async move(from: string, to: string): Promise<void> {
    const source = this.pathOf(from);
    const target = this.pathOf(to);
    await mkdir(path.dirname(target), { recursive: true });
    try {
      await rename(source, target);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'ENOENT') throw new StorageNotFoundError(from);
      throw e;
    }
  }
}
