// Photos in an S3-compatible bucket, so every process (on any host) reads what any other wrote.
// The SDK is loaded only when a bucket is configured: it takes about a second to import, and
// a single process on local disk should not pay for it at start-up.
import type { Readable } from 'node:stream';
import type { S3Client } from '@aws-sdk/client-s3';
import type { S3Settings } from '../config/env';
import { isPhotoKey, type PhotoStore } from './photo-store';

type Sdk = typeof import('@aws-sdk/client-s3');

/** The answers that mean "no such object" (GetObject says NoSuchKey, HeadObject only 404). */
function isMissing(error: unknown): boolean {
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === 'NoSuchKey' || e?.name === 'NotFound' || (e?.$metadata?.httpStatusCode === 404 && e?.name !== 'NoSuchBucket');
}

export interface S3PhotoStore extends PhotoStore {
  /** Ends the client's sockets (for a clean stop). */
  close(): Promise<void>;
}

export function createS3PhotoStore(settings: S3Settings): S3PhotoStore {
  let client: Promise<{ sdk: Sdk; s3: S3Client }> | null = null;
  const connect = () =>
    (client ??= import('@aws-sdk/client-s3').then((sdk) => ({
      sdk,
      s3: new sdk.S3Client({
        endpoint: settings.endpoint,
        region: settings.region,
        forcePathStyle: settings.forcePathStyle,
        credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
        // A photo read or write that cannot reach the store fails in seconds, not minutes.
        maxAttempts: 3,
      }),
    })));
  const checked = (key: string): string => {
    if (!isPhotoKey(key)) throw new Error(`Not a photo key: ${JSON.stringify(key)}`);
    return key;
  };
  const bucket = settings.bucket;
  return {
    async put(key, data, contentType) {
      const { sdk, s3 } = await connect();
      await s3.send(new sdk.PutObjectCommand({ Bucket: bucket, Key: checked(key), Body: data, ContentType: contentType, ContentLength: data.length }));
    },
    async get(key) {
      if (!isPhotoKey(key)) return null;
      const { sdk, s3 } = await connect();
      try {
        const object = await s3.send(new sdk.GetObjectCommand({ Bucket: bucket, Key: key }));
        if (!object.Body) return null;
        return { stream: object.Body as Readable, contentType: object.ContentType ?? 'image/jpeg', size: Number(object.ContentLength ?? 0) };
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      if (!isPhotoKey(key)) return;
      const { sdk, s3 } = await connect();
      // S3 answers a delete of a missing key with success, which is what the interface asks.
      await s3.send(new sdk.DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },
    async close() {
      if (client) (await client).s3.destroy();
      client = null;
    },
  };
}
