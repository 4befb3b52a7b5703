import { Router } from 'express';
import { getSequelize } from '../../db/sequelize';

export function healthRouter(): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    let db = false;
    try {
      await getSequelize().query('SELECT 1');
      db = true;
    } catch {
      db = false;
    }
    res.status(db ? 200 : 503).json({ ok: db, db });
  });
  return router;
}
