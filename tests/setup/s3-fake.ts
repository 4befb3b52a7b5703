// A local S3-compatible store for the tests: @20minutes/s3rver on 127.0.0.1, keeping its
// objects in a folder under the test run's temporary directory.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from '@20minutes/s3rver';
import { HeadObjectCommand, S3Client } from '@aws-sdk/client-s3';

export interface S3Fake {
  bucket: string;
  endpoint: string;
  /** The S3_ settings that point Sporewell at this bucket. */
  env: Record<string, string>;
  /** Whether the bucket holds `key` (asked over the S3 API). */
  has(key: string): Promise<boolean>;
  close(): Promise<void>;
}

// The fake's fixed credentials (its documented defaults).
const ACCESS_KEY_ID = 'S3RVER';
const SECRET_ACCESS_KEY = 'S3RVER';

export async function startS3Fake(bucket = 'sporewell-photos'): Promise<S3Fake> {
  // The SDK's notice that its 2027 releases need Node 22 would be printed by every test file.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
  const directory = fs.mkdtempSync(path.join(process.env.TEST_TMP ?? os.tmpdir(), 's3-'));
  const fake = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory, configureBuckets: [{ name: bucket }] });
  const { port } = await fake.run();
  const endpoint = `http://127.0.0.1:${port}`;
  const client = new S3Client({
    endpoint,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: ACCESS_KEY_ID, secretAccessKey: SECRET_ACCESS_KEY },
  });
  return {
    bucket,
    endpoint,
    env: {
      S3_BUCKET: bucket,
      S3_ENDPOINT: endpoint,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: ACCESS_KEY_ID,
      S3_SECRET_ACCESS_KEY: SECRET_ACCESS_KEY,
      S3_FORCE_PATH_STYLE: 'true',
    },
    async has(key) {
      try {
        await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
        return true;
      } catch (error) {
        if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return false;
        throw error;
      }
    },
    async close() {
      client.destroy();
      await fake.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
