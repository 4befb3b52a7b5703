// The batch shelf (owner only) and the sugar & water check (open to anyone, visitors too).
// Mounted at /api.
import { Router } from 'express';
import { batchCheckInputSchema, checkBatch } from '../../../shared/batch-check';
import { batchCreateSchema, batchPatchSchema } from '../../../shared/case-schemas';
import type { AppContext } from '../../context';
import { pageQuery, parseId, parseOr400, requireSignedIn, requireUser } from '../../lib/http';
import { batchesService } from './batches.service';

export function batchesRouter(_ctx: AppContext): Router {
  const router = Router();

  router.post('/batch-check', (req, res) => {
    const input = parseOr400(batchCheckInputSchema, req.body, 'Some of the numbers need fixing.');
    res.json(checkBatch(input));
  });

  router.get('/batches', requireSignedIn, async (req, res) => {
    const { page, pageSize } = parseOr400(pageQuery, req.query);
    res.json(await batchesService.list(requireUser(req).id, page, pageSize));
  });

  router.post('/batches', requireSignedIn, async (req, res) => {
    const input = parseOr400(batchCreateSchema, req.body);
    res.status(201).json(await batchesService.create(requireUser(req).id, input));
  });

  router.get('/batches/:id', requireSignedIn, async (req, res) => {
    res.json(await batchesService.read(requireUser(req).id, parseId(req.params.id, 'That batch')));
  });

  router.patch('/batches/:id', requireSignedIn, async (req, res) => {
    const id = parseId(req.params.id, 'That batch');
    const owner = requireUser(req).id;
    // Not found before "needs fixing", so a stranger learns nothing from a bad body either.
    await batchesService.ownedOr404(owner, id);
    const patch = parseOr400(batchPatchSchema, req.body);
    res.json(await batchesService.update(owner, id, patch));
  });

  return router;
}
