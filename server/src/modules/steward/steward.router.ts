import { Router } from 'express';
import { z } from 'zod';
import { roleSchema } from '../../../shared/case-status';
import type { AppContext } from '../../context';
import { pageQuery, parseOr400, requireRole } from '../../lib/http';
import { toPublicUser } from '../auth/auth.service';
import { usersRepository } from '../users/users.repository';
import { mailRouter } from '../mail/mail.router';

const usersQuery = pageQuery.extend({
  role: roleSchema.optional(),
  q: z.string().trim().max(100).optional(),
});

export function stewardRouter(ctx: AppContext): Router {
  const router = Router();
  router.use(requireRole('steward'));

  router.get('/users', async (req, res) => {
    const query = parseOr400(usersQuery, req.query);
    const { items, total } = await usersRepository.list(query);
    res.json({
      items: items.map((u) => ({ ...toPublicUser(u), disabled: u.disabled, createdAt: u.createdAt })),
      total,
      page: query.page,
      pageSize: query.pageSize,
    });
  });

  router.use('/mail', mailRouter(ctx));
  return router;
}
