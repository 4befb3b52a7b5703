// Photos in: multer holds the request's files in memory under explicit limits (its defaults are
// Infinity), each file's magic bytes are checked (a renamed HTML page is not a photo), and sharp
// decodes it under a pixel cap, turns it upright, and writes a fresh JPEG with no metadata at
// all (no EXIF, GPS included, no XMP, no IPTC), at most 2048 px on the long side, plus a 400 px
// thumbnail. Nothing is stored here: the caller stores only after every file passed.
import type { Request, Response } from 'express';
import { fileTypeFromBuffer } from 'file-type';
import multer from 'multer';
import sharp, { type Metadata } from 'sharp';
import { PHOTO_LIMITS } from '../../shared/case-schemas';
import { AppError } from './errors';

export const UPLOAD_LIMITS = {
  fileSize: PHOTO_LIMITS.maxFileBytes,
  files: PHOTO_LIMITS.maxFiles,
  fields: 10,
  parts: 20,
  fieldSize: 1024,
  fieldNameSize: 100,
  headerPairs: 200,
} as const;

const upload = multer({ storage: multer.memoryStorage(), limits: UPLOAD_LIMITS });

const MULTER_ERRORS: Record<string, [number, string, string]> = {
  LIMIT_FILE_SIZE: [413, 'file_too_large', `Each photo can be at most ${PHOTO_LIMITS.maxFileBytes / 1024 / 1024} MB.`],
  LIMIT_FILE_COUNT: [413, 'too_many_files', `Send at most ${PHOTO_LIMITS.maxFiles} photos at a time.`],
  LIMIT_PART_COUNT: [413, 'too_many_parts', 'The upload has too many parts.'],
  LIMIT_FIELD_COUNT: [413, 'too_many_fields', 'The upload has too many fields.'],
  LIMIT_FIELD_KEY: [400, 'bad_upload', 'A field name in the upload is too long.'],
  LIMIT_FIELD_VALUE: [400, 'bad_upload', 'A field in the upload is too long.'],
  LIMIT_UNEXPECTED_FILE: [400, 'unexpected_file', 'Send the photos in the form field "photos".'],
};

/** Reads the multipart body (field `photos`) into memory, or throws a 400/413 AppError. */
export function receivePhotos(req: Request, res: Response): Promise<Express.Multer.File[]> {
  if (!req.is('multipart/form-data')) {
    return Promise.reject(new AppError(400, 'bad_upload', 'Send the photos as multipart/form-data in the field "photos".'));
  }
  return new Promise((resolve, reject) => {
    upload.array('photos')(req, res, (error: unknown) => {
      if (!error) return resolve((req.files as Express.Multer.File[] | undefined) ?? []);
      if (error instanceof multer.MulterError) {
        const [status, code, message] = MULTER_ERRORS[error.code] ?? [400, 'bad_upload', 'The upload could not be read.'];
        return reject(new AppError(status, code, message));
      }
      reject(new AppError(400, 'bad_upload', 'The upload could not be read.'));
    });
  });
}

export interface IntakenImage {
  full: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
  thumbWidth: number;
  thumbHeight: number;
}

const ACCEPTED = new Set<string>(PHOTO_LIMITS.acceptedTypes);

function refuse(code: string, message: string, which: string): AppError {
  return new AppError(400, code, message, { photos: `${which}: ${message}` });
}

/** Checks and re-encodes one photo; `which` names it in the error ("photo 2"). */
export async function intakeImage(data: Buffer, which: string): Promise<IntakenImage> {
  const type = await fileTypeFromBuffer(data);
  if (!type || !ACCEPTED.has(type.mime)) {
    const what = type?.mime === 'image/heic' || type?.mime === 'image/heif' ? 'HEIC photos are not taken yet; save it as JPEG' : 'That is not a JPEG, PNG or WebP photo';
    throw refuse('not_an_image', `${what}.`, which);
  }
  const options = { limitInputPixels: PHOTO_LIMITS.maxPixels, failOn: 'error' as const };
  let meta: Metadata;
  try {
    // Reads the header only; sharp already refuses past limitInputPixels here.
    meta = await sharp(data, options).metadata();
  } catch (error) {
    throw decodeRefusal(error, which);
  }
  const pixels = (meta.width ?? 0) * (meta.height ?? 0) * Math.max(1, meta.pages ?? 1);
  if (!meta.width || !meta.height || pixels > PHOTO_LIMITS.maxPixels) throw tooManyPixels(which);
  try {
    // .rotate() first: it turns the picture upright from its EXIF orientation, which is then
    // dropped with every other piece of metadata (sharp writes none unless told to).
    const { data: full, info } = await sharp(data, options)
      .rotate()
      .resize({ width: PHOTO_LIMITS.longSide, height: PHOTO_LIMITS.longSide, fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 82 })
      .toBuffer({ resolveWithObject: true });
    const { data: thumb, info: thumbInfo } = await sharp(full)
      .resize({ width: PHOTO_LIMITS.thumbLongSide, height: PHOTO_LIMITS.thumbLongSide, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 75 })
      .toBuffer({ resolveWithObject: true });
    return { full, thumb, width: info.width, height: info.height, thumbWidth: thumbInfo.width, thumbHeight: thumbInfo.height };
  } catch (error) {
    throw decodeRefusal(error, which);
  }
}

const tooManyPixels = (which: string) =>
  refuse('too_many_pixels', `The photo has too many pixels (at most ${PHOTO_LIMITS.maxPixels / 1_000_000} million).`, which);

function decodeRefusal(error: unknown, which: string): AppError {
  if (/pixel limit/i.test(String((error as Error)?.message))) return tooManyPixels(which);
  return refuse('unreadable_image', 'The photo could not be read; it may be damaged.', which);
}
