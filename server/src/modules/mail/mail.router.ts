import { Router } from 'express';
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { AppError } from '../../lib/errors';
import { pageQuery, parseOr400 } from '../../lib/http';

/** The mail the local catcher holds (steward only; mounted under /api/steward). */
export function mailRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    if (!ctx.config.useMailCatcher) {
      throw new AppError(404, 'not_found', 'Mail goes to a real mail server here; there is no local catcher to read.');
    }
    const { page, pageSize } = parseOr400(pageQuery, req.query);
    const sequelize = getSequelize();
    const items = await sequelize.query<{ id: string; to: string; subject: string; text: string; receivedAt: Date }>(
      `SELECT id, envelope_to AS "to", subject, body_text AS "text", created_at AS "receivedAt"
         FROM caught_mail ORDER BY id DESC LIMIT :limit OFFSET :offset`,
      { replacements: { limit: pageSize, offset: (page - 1) * pageSize }, type: QueryTypes.SELECT },
    );
    const [{ n }] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM caught_mail`, { type: QueryTypes.SELECT });
    res.json({ items: items.map((m) => ({ ...m, id: Number(m.id) })), total: Number(n), page, pageSize });
  });
  return router;
}
