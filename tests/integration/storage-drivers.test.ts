// The storage drivers: S3-compatible (against s3rver on 127.0.0.1) and local disk do the same put/get/delete round trip.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import S3rver from 's3rver';
import { readConfig } from '@/server/core/config';
import { storageFromConfig } from '@/server/storage';
import { localDiskStorage } from '@/server/storage/local-disk';
import { s3Storage } from '@/server/storage/s3';
import type { StorageDriver } from '@/server/storage/storage-driver';

const directory = mkdtempSync(join(tmpdir(), 'benchlore-s3rver-'));
let server: S3rver;
let endpoint = '';

beforeAll(async () => {
  server = new S3rver({ port: 0, address: '127.0.0.1', directory, silent: true, configureBuckets: [{ name: 'bench-photos' }] });
  const { port } = await server.run();
  endpoint = `http://127.0.0.1:${port}`;
});
afterAll(async () => {
  await server?.close();
  rmSync(directory, { recursive: true, force: true });
});

async function roundTrip(driver: StorageDriver): Promise<void> {
  const key = `photos/ab/test-${Date.now()}-960.jpg`;
  const body = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3, 4, 0xff, 0xd9]);
  await driver.put(key, body, 'image/jpeg');
  const got = await driver.get(key);
  expect(got?.body.equals(body)).toBe(true);
  expect(got?.contentType).toBe('image/jpeg');
  const listed = [];
  for await (const object of driver.list('photos/ab/')) listed.push(object);
  expect(listed.find((o) => o.key === key)?.modifiedAt).toBeInstanceOf(Date);
  await driver.delete(key);
  expect(await driver.get(key)).toBeNull();
  const after = [];
  for await (const object of driver.list('photos/ab/')) after.push(object.key);
  expect(after).not.toContain(key);
  for await (const object of driver.list('photos/never-used-prefix/')) expect.unreachable(`listed ${object.key}`);
  // Deleting what is not there is not an error.
  await driver.delete(key);
}

describe('S3-compatible storage', () => {
  it('puts, gets and deletes an object through path-style requests', async () => {
    await roundTrip(s3Storage({ endpoint, bucket: 'bench-photos', region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }));
  });

  it('answers null for a key that was never stored', async () => {
    const driver = s3Storage({ endpoint, bucket: 'bench-photos', region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' });
    expect(await driver.get('photos/zz/never-stored.webp')).toBeNull();
  });

  it('refuses keys that are not ours before any request', async () => {
    const driver = s3Storage({ endpoint, bucket: 'bench-photos', region: 'us-east-1' });
    await expect(driver.put('../escape.jpg', Buffer.from('x'), 'image/jpeg')).rejects.toThrow(/Invalid storage key/);
  });

  it('is the driver chosen when S3_ENDPOINT and S3_BUCKET are set', async () => {
    const config = readConfig({
      S3_ENDPOINT: endpoint,
      S3_BUCKET: 'bench-photos',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
    });
    await roundTrip(storageFromConfig(config));
  });
});

describe('local-disk storage', () => {
  it('does the same round trip under its folder', async () => {
    const root = mkdtempSync(join(tmpdir(), 'benchlore-media-'));
    try {
      await roundTrip(localDiskStorage(root));
      await roundTrip(storageFromConfig(readConfig({ BENCHLORE_MEDIA_DIR: root })));
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
