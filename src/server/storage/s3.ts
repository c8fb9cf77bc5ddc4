// S3-compatible object storage (AWS, MinIO, a local s3rver in tests) behind the one storage interface.
import {
  DeleteObjectCommand,
  GetObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { assertKey, type StorageDriver } from './storage-driver';

export interface S3Settings {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
}

function isMissing(error: unknown): boolean {
  if (error instanceof S3ServiceException) return error.name === 'NoSuchKey' || error.$metadata.httpStatusCode === 404;
  return (error as { name?: string }).name === 'NoSuchKey';
}

export function s3Storage(settings: S3Settings): StorageDriver {
  const client = new S3Client({
    endpoint: settings.endpoint,
    region: settings.region,
    // Path-style addressing (endpoint/bucket/key) works with every S3-compatible server, virtual hosts need DNS.
    forcePathStyle: true,
    ...(settings.accessKeyId && settings.secretAccessKey
      ? { credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey } }
      : {}),
  });
  const bucket = settings.bucket;
  return {
    async put(key, body, contentType) {
      assertKey(key);
      await client.send(
        new PutObjectCommand({
          Bucket: bucket,
          Key: key,
          Body: body,
          ContentType: contentType,
          CacheControl: 'public, max-age=31536000, immutable',
        }),
      );
    },
    async get(key) {
      assertKey(key);
      try {
        const object = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
        if (!object.Body) return null;
        const body = Buffer.from(await object.Body.transformToByteArray());
        return { body, contentType: object.ContentType ?? 'application/octet-stream' };
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      assertKey(key);
      // Deleting a key that is not there succeeds on S3, as it does on local disk.
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },
    async *list(prefix) {
      let token: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token }));
        for (const object of page.Contents ?? []) {
          if (object.Key) yield { key: object.Key, modifiedAt: object.LastModified ?? new Date(0) };
        }
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
    },
  };
}
