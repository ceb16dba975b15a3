/**
 * Full series read back from storage, kept decoded in memory (least recently used first out, bounded
 * by bytes). A series file never changes once its analysis is done — a new analysis writes a new key —
 * so entries never go stale.
 */
import type { Storage } from '../../storage/storage';
import { decodeSeries, type Series } from '../../jobs/series-file';

export class SeriesCache {
  private readonly entries = new Map<string, Series>();
  private readonly loading = new Map<string, Promise<Series>>();
  private bytes = 0;

  constructor(
    private readonly storage: Storage,
    private readonly maxBytes = 64 * 1024 * 1024,
  ) {}

  async get(key: string): Promise<Series> {
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit); // most recent last
      return hit;
    }
    let pending = this.loading.get(key);
    if (!pending) {
      pending = this.load(key).finally(() => this.loading.delete(key));
      this.loading.set(key, pending);
    }
    return pending;
  }

  forget(key: string): void {
    const e = this.entries.get(key);
    if (e) {
      this.bytes -= sizeOf(e);
      this.entries.delete(key);
    }
  }

  private async load(key: string): Promise<Series> {
    const stream = await this.storage.open(key);
    const chunks: Buffer[] = [];
    for await (const chunk of stream) chunks.push(chunk as Buffer);
    const series = decodeSeries(Buffer.concat(chunks));
    const size = sizeOf(series);
    if (size <= this.maxBytes) {
      this.entries.set(key, series);
      this.bytes += size;
      for (const [k, v] of this.entries) {
        if (this.bytes <= this.maxBytes) break;
        this.entries.delete(k);
        this.bytes -= sizeOf(v);
      }
    }
    return series;
  }
}

const sizeOf = (s: Series) => s.frequencyHz.byteLength + s.psd.byteLength;

/** A Map that keeps at most `capacity` entries, dropping the least recently used. */
export class LruMap<K, V> {
  private readonly map = new Map<K, V>();
  constructor(private readonly capacity: number) {}

  get(key: K): V | undefined {
    const v = this.map.get(key);
    if (v !== undefined) {
      this.map.delete(key);
      this.map.set(key, v);
    }
    return v;
  }

  set(key: K, value: V): void {
    this.map.delete(key);
    this.map.set(key, value);
    if (this.map.size > this.capacity) this.map.delete(this.map.keys().next().value as K);
  }
}
