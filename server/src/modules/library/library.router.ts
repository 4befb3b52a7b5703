// The Field Library (PRODUCT.md screen 8), open to visitors. Mounted at /api/library.
//   GET /api/library?q=&stage=&symptom=&kind=guide|note&page=&pageSize=  → LibraryList
//   GET /api/library/:slug                                              → LibraryEntry
//   GET /api/library/:slug/photos/:photoId(/thumb)                      → a photo the note lists
//   POST /api/library/:slug/take-down  a steward { reason }              → the case's ClosingState
import { Router, type Response } from 'express';
import { takeDownSchema } from '../../../shared/closing-schemas';
import { libraryQuerySchema } from '../../../shared/library-query';
import type { AppContext } from '../../context';
import { notFound } from '../../lib/errors';
import { parseId, parseOr400, requireRole, requireUser } from '../../lib/http';
import { createPhotoStore } from '../../lib/photo-store';
import { takeOutOfLibrary } from '../closing/closing.service';
import { getLibraryEntry, noteCaseId, notePhotoKey, searchLibrary } from './library.service';

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

  // Curating the library: a steward takes a field note out (its case keeps everything; a steward
  // can put the note back from the case page). Guides come from the knowledge/ folder instead.
  router.post('/:slug/take-down', requireRole('steward'), async (req, res) => {
    const user = requireUser(req);
    const { reason } = parseOr400(takeDownSchema, req.body, 'Taking the note out needs a reason.');
    const caseId = await noteCaseId(String(req.params.slug));
    res.json(await takeOutOfLibrary(ctx, user, caseId, reason));
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
