// Picks the storage driver from configuration, once per process.
import { join } from 'node:path';
import { config } from '../config';
import { localDiskStorage } from './local-disk';
import type { StorageDriver } from './storage-driver';

let driver: StorageDriver | undefined;

export function storage(): StorageDriver {
  driver ??= localDiskStorage(config().BENCHLORE_MEDIA_DIR ?? join(config().BENCHLORE_DATA_DIR, 'media'));
  return driver;
}

export function mediaUrl(key: string): string {
  return `/media/${key}`;
}
