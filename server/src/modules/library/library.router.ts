// TODO(issue 5): the Field Library (GET /api/library, GET /api/library/:slug). Mounted at /api/library.
import { Router } from 'express';
import type { AppContext } from '../../context';

export function libraryRouter(_ctx: AppContext): Router {
  return Router();
}
