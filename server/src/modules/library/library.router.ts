// The Field Library (PRODUCT.md screen 8), open to visitors. Mounted at /api/library.
//   GET /api/library?q=&stage=&symptom=&kind=guide|note&page=&pageSize=  → LibraryList
//   GET /api/library/:slug                                              → LibraryEntry
//   GET /api/library/:slug/photos/:photoId(/thumb)                      → a photo the note lists
import { Router, type Response } from 'express';
import { libraryQuerySchema } from '../../../shared/library-query';
import type { AppContext } from '../../context';
import { parseId, parseOr400 } from '../../lib/http';
import { createPhotoStore } from '../../lib/photo-store';
import { notFound } from '../../lib/errors';
import { getLibraryEntry, notePhotoKey, searchLibrary } from './library.service';

export function libraryRouter(ctx: AppContext): Router {
  const router = Router();
  const photos = createPhotoStore(ctx.config);

  router.get('/', async (req, res) => {
    const query = parseOr400(libraryQuerySchema, req.query, 'That search needs fixing.');
    res.json(await searchLibrary(query));
  });

  router.get('/:slug', async (req, res) => {
    res.json(await getLibraryEntry(String(req.params.slug)));
  });

  const sendPhoto = async (slug: string, photoId: unknown, thumb: boolean, res: Response) => {
    const key = await notePhotoKey(slug, parseId(photoId, 'That photo'), thumb);
    const stored = await photos.get(key);
    if (!stored) throw notFound('That photo');
    res.set({ 'Content-Type': stored.contentType, 'Content-Length': String(stored.size), 'X-Content-Type-Options': 'nosniff' });
    stored.stream.pipe(res);
  };
  router.get('/:slug/photos/:photoId', (req, res) => sendPhoto(String(req.params.slug), req.params.photoId, false, res));
  router.get('/:slug/photos/:photoId/thumb', (req, res) => sendPhoto(String(req.params.slug), req.params.photoId, true, res));

  return router;
}
