// Cases: open, list (the rounds and a grower's own), read, batches like this (growers get field
// notes, staff the cases: similar.service.ts), and private photos. Mounted at /api/cases after
// the threads router (messages, claim, status, hand-over).
import { pipeline } from 'node:stream/promises';
import { Router, type Request, type Response } from 'express';
import { openCaseSchema, similarDraftSchema, similarQuerySchema } from '../../../shared/case-schemas';
import { toGrams } from '../../../shared/units';
import type { AppContext } from '../../context';
import { notFound } from '../../lib/errors';
import { parseId, parseOr400, requireSignedIn, requireUser } from '../../lib/http';
import { createPhotoStore, type PhotoStore } from '../../lib/photo-store';
import { readableCaseOr404 } from './case-access';
import { casesRepository } from './cases.repository';
import { casesService } from './cases.service';
import { openPhoto, uploadPhotos } from './photos.service';
import { listCasesHandler } from './rounds-page';
import { findSimilarFor } from './similar.service';

export function casesRouter(ctx: AppContext, store: PhotoStore = createPhotoStore(ctx.config)): Router {
  const router = Router();

  router.get('/', requireSignedIn, listCasesHandler(ctx));

  router.post('/', requireSignedIn, async (req, res) => {
    const input = parseOr400(openCaseSchema, req.body);
    res.status(201).json(await casesService.open(requireUser(req), input));
  });

  router.post('/similar', requireSignedIn, async (req, res) => {
    const user = requireUser(req);
    const draft = parseOr400(similarDraftSchema, req.body);
    const ratio = draft.numbers ? toGrams(draft.numbers.sugar.value, draft.numbers.sugar.unit) / toGrams(draft.numbers.culture.value, draft.numbers.culture.unit) : null;
    res.json(
      await findSimilarFor(user, {
        stage: draft.stage ?? null,
        symptoms: draft.symptoms,
        text: `${draft.title}\n${draft.description}`,
        ratio,
        limit: draft.limit,
      }),
    );
  });

  router.get('/:id', requireSignedIn, async (req, res) => {
    res.json(await casesService.read(requireUser(req), parseId(req.params.id, 'That case')));
  });

  router.get('/:id/similar', requireSignedIn, async (req, res) => {
    const id = parseId(req.params.id, 'That case');
    await readableCaseOr404(req.user, id);
    const { limit } = parseOr400(similarQuerySchema, req.query);
    const row = await casesRepository.findDetail(id);
    if (!row) throw notFound('That case');
    res.json(
      await findSimilarFor(requireUser(req), {
        stage: row.stage,
        symptoms: row.symptoms,
        text: `${row.title}\n${row.description}`,
        ratio: row.sugarRatio,
        excludeId: id,
        limit,
      }),
    );
  });

  router.post('/:id/photos', requireSignedIn, async (req, res) => {
    const id = parseId(req.params.id, 'That case');
    res.status(201).json(await uploadPhotos(requireUser(req), id, req, res, store));
  });

  const servePhoto = (which: 'full' | 'thumb') =>
    async (req: Request, res: Response) => {
      const caseId = parseId(req.params.id, 'That case');
      const photoId = parseId(req.params.photoId, 'That photo');
      const photo = await openPhoto(req.user, caseId, photoId, which, store);
      res.set({
        'Content-Type': 'image/jpeg',
        'Content-Length': String(photo.size),
        'X-Content-Type-Options': 'nosniff',
        'Cache-Control': 'private, max-age=86400',
        'Content-Disposition': `inline; filename="photo-${photoId}${which === 'thumb' ? '-thumb' : ''}.jpg"`,
        'Cross-Origin-Resource-Policy': 'same-origin',
      });
      await pipeline(photo.stream, res);
    };
  router.get('/:id/photos/:photoId', servePhoto('full'));
  router.get('/:id/photos/:photoId/thumb', servePhoto('thumb'));

  return router;
}
