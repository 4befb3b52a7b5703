// Where photo bytes live. Kept to three calls so an S3-compatible store stands in when several
// processes share the work (PRODUCT.md "How it runs"): local disk by default, the bucket when
// every S3_ setting is given. Keys are chosen here, never from a client's file name, and a key
// that does not look like one of ours is refused before it reaches the file system or bucket.
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Readable } from 'node:stream';
import type { Config } from '../config/env';
import { createS3PhotoStore, type S3PhotoStore } from './s3-photo-store';

export interface StoredPhoto {
  stream: Readable;
  contentType: string;
  size: number;
}

export interface PhotoStore {
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /** null when there is no such object */
  get(key: string): Promise<StoredPhoto | null>;
  /** no error when it is already gone */
  delete(key: string): Promise<void>;
}

const KEY_PATTERN = /^[0-9a-f]{2}\/[0-9a-f]{32}(-thumb)?\.jpg$/;

/** A fresh key pair for one photo: the picture and its thumbnail. */
export function newPhotoKeys(): { key: string; thumbKey: string } {
  const id = crypto.randomBytes(16).toString('hex');
  const dir = id.slice(0, 2);
  return { key: `${dir}/${id}.jpg`, thumbKey: `${dir}/${id}-thumb.jpg` };
}

export function isPhotoKey(key: string): boolean {
  return KEY_PATTERN.test(key);
}

export function createLocalPhotoStore(rootDir: string): PhotoStore {
  const root = path.resolve(rootDir);
  const fileOf = (key: string): string => {
    if (!isPhotoKey(key)) throw new Error(`Not a photo key: ${JSON.stringify(key)}`);
    return path.join(root, key);
  };
  return {
    async put(key, data) {
      const file = fileOf(key);
      await fs.promises.mkdir(path.dirname(file), { recursive: true });
      // Write aside and rename, so a reader never sees half a file.
      const partial = `${file}.${process.pid}.part`;
      try {
        await fs.promises.writeFile(partial, data, { flag: 'wx', mode: 0o640 });
        await fs.promises.rename(partial, file);
      } catch (error) {
        await fs.promises.rm(partial, { force: true });
        throw error;
      }
    },
    async get(key) {
      if (!isPhotoKey(key)) return null;
      const file = fileOf(key);
      try {
        const stat = await fs.promises.stat(file);
        return { stream: fs.createReadStream(file), contentType: 'image/jpeg', size: stat.size };
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw error;
      }
    },
    async delete(key) {
      if (!isPhotoKey(key)) return;
      await fs.promises.rm(fileOf(key), { force: true });
    },
  };
}

const s3Stores = new Map<string, S3PhotoStore>();

/** The store this configuration names; one S3 client per bucket and endpoint, shared by the routers. */
export function createPhotoStore(config: Pick<Config, 's3' | 'UPLOAD_DIR'>): PhotoStore {
  if (!config.s3) return createLocalPhotoStore(path.resolve(config.UPLOAD_DIR));
  const id = `${config.s3.endpoint}|${config.s3.bucket}|${config.s3.accessKeyId}`;
  let store = s3Stores.get(id);
  if (!store) s3Stores.set(id, (store = createS3PhotoStore(config.s3)));
  return store;
}

/** Ends the bucket clients' connections (the server's graceful stop). */
export async function closePhotoStores(): Promise<void> {
  const stores = [...s3Stores.values()];
  s3Stores.clear();
  await Promise.all(stores.map((s) => s.close()));
}
