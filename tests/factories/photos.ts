// Photo uploads as a browser sends them, and what the server left behind: files under the
// photo store and rows in case_photos (the upload tests count both).
import fs from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import type supertest from 'supertest';
import { getSequelize } from '../../server/src/db/sequelize';
import { TEST_ORIGIN } from '../setup/test-app';

type Browser = ReturnType<typeof supertest.agent>;

export interface UploadFile {
  data: Buffer;
  name: string;
  /** what the browser claims; the server must not believe it (default image/jpeg) */
  contentType?: string;
}

/** Every file below `dir`, with its full path. */
export function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
}

export async function photoRows(caseId: number): Promise<number> {
  const [row] = await getSequelize().query<{ n: number }>(`SELECT count(*)::int AS n FROM case_photos WHERE case_id = :caseId`, {
    replacements: { caseId },
    type: QueryTypes.SELECT,
  });
  return row.n;
}

/** Sends files in the field `photos`; a server that stops reading early may reset the socket, which counts as its answer. */
export function uploadPhotos(browser: Browser, caseId: number, files: UploadFile[], fields: Record<string, string> = {}) {
  let req = browser.post(`/api/cases/${caseId}/photos`).set({ Origin: TEST_ORIGIN });
  for (const [key, value] of Object.entries(fields)) req = req.field(key, value);
  for (const file of files) req = req.attach('photos', file.data, { filename: file.name, contentType: file.contentType ?? 'image/jpeg' });
  return req;
}

/** GETs a URL and keeps the body as raw bytes, whatever its content type. */
export function getBytes(browser: Browser, url: string) {
  return browser
    .get(url)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
}
