// Private photos of a case. An upload is all or nothing: every file is checked and re-encoded
// in memory first, files are written only after all of them passed, the rows go in one
// transaction, and if anything fails after the first write, what was written is deleted.
import type { Request, Response } from 'express';
import { photoFieldsSchema, type PhotoView } from '../../../shared/case-schemas';
import { getSequelize } from '../../db/sequelize';
import { AppError, notFound } from '../../lib/errors';
import { parseOr400 } from '../../lib/http';
import { intakeImage, receivePhotos, type IntakenImage } from '../../lib/image-intake';
import { log } from '../../lib/logger';
import { newPhotoKeys, type PhotoStore, type StoredPhoto } from '../../lib/photo-store';
import { readableCaseOr404 } from './case-access';
import { casesRepository } from './cases.repository';
import { photoView, visibilityOf } from './cases.service';

/** A client's file name, only to say which file was refused (never used to store anything). */
function nameOf(file: Express.Multer.File, index: number): string {
  const name = (file.originalname ?? '').replace(/[^\p{L}\p{N} ._()-]/gu, '').slice(0, 60);
  return name ? `photo ${index + 1} (${name})` : `photo ${index + 1}`;
}

export async function uploadPhotos(user: Express.User, caseId: number, req: Request, res: Response, store: PhotoStore): Promise<{ photos: PhotoView[] }> {
  // Access first, so a stranger's upload is not even read.
  await readableCaseOr404(user, caseId);
  const files = await receivePhotos(req, res);
  if (files.length === 0) throw new AppError(400, 'no_photos', 'Choose at least one photo (form field "photos").', { photos: 'Choose at least one photo.' });
  const fields = parseOr400(photoFieldsSchema, req.body ?? {});
  let messageId: number | null = null;
  if (fields.messageId !== undefined) {
    const message = await casesRepository.messageOfCase(caseId, fields.messageId);
    const visible = message && (message.kind !== 'aside' || visibilityOf(user).asides);
    if (!visible) throw new AppError(400, 'invalid_input', 'That message is not in this case.', { messageId: 'That message is not in this case.' });
    messageId = fields.messageId;
  }
  const purpose = fields.purpose ?? (messageId !== null ? 'thread' : 'case');

  const images: IntakenImage[] = [];
  for (const [index, file] of files.entries()) images.push(await intakeImage(file.buffer, nameOf(file, index)));

  const written: string[] = [];
  try {
    const stored: { storageKey: string; thumbKey: string; width: number; height: number; bytes: number }[] = [];
    for (const image of images) {
      const { key, thumbKey } = newPhotoKeys();
      await store.put(key, image.full, 'image/jpeg');
      written.push(key);
      await store.put(thumbKey, image.thumb, 'image/jpeg');
      written.push(thumbKey);
      stored.push({ storageKey: key, thumbKey, width: image.width, height: image.height, bytes: image.full.length });
    }
    const rows = await getSequelize().transaction((transaction) =>
      casesRepository.insertPhotos(caseId, user.id, { purpose, messageId }, stored, transaction),
    );
    log.info('photos.stored', { caseId, userId: user.id, count: rows.length });
    return { photos: rows.map(photoView) };
  } catch (error) {
    await Promise.all(written.map((key) => store.delete(key).catch(() => undefined)));
    throw error;
  }
}

/** The photo (or its thumbnail) for who may read the case, else 404. */
export async function openPhoto(user: Express.User | undefined, caseId: number, photoId: number, which: 'full' | 'thumb', store: PhotoStore): Promise<StoredPhoto> {
  await readableCaseOr404(user, caseId);
  const [row] = await casesRepository.photos(caseId, visibilityOf(user!), photoId);
  if (!row) throw notFound('That photo');
  const stored = await store.get(which === 'thumb' ? row.thumbKey : row.storageKey);
  if (!stored) throw notFound('That photo');
  return stored;
}
