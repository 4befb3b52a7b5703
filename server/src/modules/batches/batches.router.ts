// TODO(issue 3): the batch shelf (GET/POST /api/batches, GET/PATCH /api/batches/:id) and POST /api/batch-check. Mounted at /api.
import { Router } from 'express';
import type { AppContext } from '../../context';

export function batchesRouter(_ctx: AppContext): Router {
  return Router();
}
