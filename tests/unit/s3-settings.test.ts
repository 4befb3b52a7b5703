import { describe, expect, test } from 'vitest';
import { ConfigError, parseConfig } from '../../server/src/config/env';

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db', SESSION_SECRET: 'x'.repeat(32) };
const bucket = {
  S3_BUCKET: 'larchmere-photos',
  S3_ENDPOINT: 'http://127.0.0.1:9000',
  S3_REGION: 'eu-west-1',
  S3_ACCESS_KEY_ID: 'key-id',
  S3_SECRET_ACCESS_KEY: 'secret',
};

describe('photo storage settings', () => {
  test('when no S3_ setting is given, then photos stay in UPLOAD_DIR', () => {
    expect(parseConfig(base).s3).toBeNull();
  });

  test('when every S3_ setting is given, then the bucket is used, path-style only when asked', () => {
    expect(parseConfig({ ...base, ...bucket }).s3).toEqual({
      bucket: 'larchmere-photos',
      endpoint: 'http://127.0.0.1:9000',
      region: 'eu-west-1',
      accessKeyId: 'key-id',
      secretAccessKey: 'secret',
      forcePathStyle: false,
    });
    expect(parseConfig({ ...base, ...bucket, S3_FORCE_PATH_STYLE: 'true' }).s3?.forcePathStyle).toBe(true);
  });

  test('when only some S3_ settings are given, then start-up fails naming each one that is missing', () => {
    try {
      parseConfig({ ...base, S3_BUCKET: 'larchmere-photos', S3_ENDPOINT: 'http://127.0.0.1:9000' });
      expect.unreachable('parseConfig should have thrown');
    } catch (error) {
      expect(error).toBeInstanceOf(ConfigError);
      const message = (error as Error).message;
      expect(message).toMatch(/missing S3_REGION, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY/);
      expect(message).toMatch(/unset every S3_ setting/);
    }
    // S3_FORCE_PATH_STYLE alone is a half setting too
    expect(() => parseConfig({ ...base, S3_FORCE_PATH_STYLE: 'true' })).toThrow(/missing S3_BUCKET, S3_ENDPOINT/);
  });

  test('when S3_ENDPOINT is not an http(s) URL, then start-up fails naming it', () => {
    expect(() => parseConfig({ ...base, ...bucket, S3_ENDPOINT: 'ftp://127.0.0.1' })).toThrow(/S3_ENDPOINT/);
    expect(() => parseConfig({ ...base, ...bucket, S3_ENDPOINT: 'minio:9000' })).toThrow(/S3_ENDPOINT/);
  });
});
