import { Router } from 'express';
import { CAUSES, REMEDIES, STAGES, SYMPTOMS } from '../../../shared/vocabulary';

export function vocabularyRouter(): Router {
  const router = Router();
  const body = { stages: STAGES, symptoms: SYMPTOMS, causes: CAUSES, remedies: REMEDIES };
  router.get('/', (_req, res) => {
    res.set('Cache-Control', 'public, max-age=300').json(body);
  });
  return router;
}
