/** Builds a Storage from its serialisable config (the server at boot, each worker thread on first use). */
import { LocalDiskStorage } from './local-disk-storage';
import type { Storage, StorageConfig } from './storage';

export function createStorage(config: StorageConfig): Storage {
  switch (config.driver) {
    case 'local':
      return new LocalDiskStorage(config.root);
  }
}
