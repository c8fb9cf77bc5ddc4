// The one storage interface for photos: local disk by default, S3-compatible storage when configured.
export interface StoredObject {
  body: Buffer;
  contentType: string;
}

export interface StorageDriver {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<StoredObject | null>;
  delete(key: string): Promise<void>;
  /** Every stored key under `prefix` with when it was written, for integrity checks and collecting orphans. */
  list(prefix: string): AsyncIterable<{ key: string; modifiedAt: Date }>;
}

/** Keys are our own: lower-case path segments of letters, digits, dashes and dots. */
export const storageKeyPattern = /^[a-z0-9][a-z0-9._-]*(\/[a-z0-9][a-z0-9._-]*)*$/;

export function assertKey(key: string): void {
  if (!storageKeyPattern.test(key) || key.includes('..')) throw new Error(`Invalid storage key: ${key}`);
}
