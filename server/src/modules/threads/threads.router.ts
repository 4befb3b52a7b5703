// TODO(issue 4): thread and workflow routes (messages, claim, hand over, status). Mounted at /api/cases.
import { Router } from 'express';
import type { AppContext } from '../../context';

export function threadsRouter(_ctx: AppContext): Router {
  return Router();
}
