// TODO(issue 3): the cases routes (list, create, read, similar, photos). Mounted at /api/cases.
import { Router } from 'express';
import type { AppContext } from '../../context';

export function casesRouter(_ctx: AppContext): Router {
  return Router();
}
