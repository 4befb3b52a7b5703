// The batch shelf (owner only) and the sugar & water check (open to anyone, visitors too).
// Mounted at /api.
import { Router } from 'express';
import { z } from 'zod';
import { batchCheckInputSchema, checkBatch } from '../../../shared/batch-check';
import { batchCreateSchema, batchPatchSchema } from '../../../shared/case-schemas';
import type { AppContext } from '../../context';
import { pageQuery, parseId, parseOr400, requireSignedIn, requireUser } from '../../lib/http';
import { batchesService } from './batches.service';

/** `finished=true` lists the batches taken off the shelf instead of those on it. */
const listQuery = pageQuery.extend({ finished: z.enum(['true', 'false'], { error: 'Say true or false.' }).optional() });

export function batchesRouter(_ctx: AppContext): Router {
  const router = Router();

  router.post('/batch-check', (req, res) => {
    const input = parseOr400(batchCheckInputSchema, req.body, 'Some of the numbers need fixing.');
    res.json(checkBatch(input));
  });

  router.get('/batches', requireSignedIn, async (req, res) => {
    const { page, pageSize, finished } = parseOr400(listQuery, req.query);
    res.json(await batchesService.list(requireUser(req).id, page, pageSize, finished === 'true'));
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
    const current = await batchesService.ownedOr404(owner, id);
    const patch = parseOr400(batchPatchSchema, req.body);
    res.json(await batchesService.update(owner, id, patch, current));
  });

  return router;
}
