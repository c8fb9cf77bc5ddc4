// Picks the storage driver from configuration, once per process: S3-compatible when S3_ENDPOINT and S3_BUCKET are set.
import { join } from 'node:path';
import { config, type Config } from '../core/config';
import { localDiskStorage } from './local-disk';
import { s3Storage } from './s3';
import type { StorageDriver } from './storage-driver';

let driver: StorageDriver | undefined;

export function storageFromConfig(settings: Config): StorageDriver {
  if (settings.S3_ENDPOINT && settings.S3_BUCKET) {
    return s3Storage({
      endpoint: settings.S3_ENDPOINT,
      bucket: settings.S3_BUCKET,
      region: settings.S3_REGION,
      accessKeyId: settings.S3_ACCESS_KEY_ID,
      secretAccessKey: settings.S3_SECRET_ACCESS_KEY,
    });
  }
  return localDiskStorage(settings.BENCHLORE_MEDIA_DIR ?? join(settings.BENCHLORE_DATA_DIR, 'media'));
}

export function storage(): StorageDriver {
  driver ??= storageFromConfig(config());
  return driver;
}

export function mediaUrl(key: string): string {
  return `/media/${key}`;
}
