import { Router } from 'express';
import { z } from 'zod';
import { roleSchema } from '../../../shared/case-status-schemas';
import { metricsQuerySchema, userChangeSchema } from '../../../shared/steward-schemas';
import type { AppContext } from '../../context';
import { pageQuery, parseId, parseOr400, requireRole, requireUser } from '../../lib/http';
import { auditRepository } from '../audit/audit';
import { closingRepository } from '../closing/closing.repository';
import { usersRepository } from '../users/users.repository';
import { mailRouter } from '../mail/mail.router';
import { stewardApplicationsRouter } from '../mentor-applications/mentor-applications.router';
import { stewardModerationRouter } from '../moderation/moderation.router';
import { communityMetrics } from './metrics.service';
import { changeUser, toStewardUser } from './people.service';

const usersQuery = pageQuery.extend({
  role: roleSchema.optional(),
  q: z.string().trim().max(100).optional(),
});

const auditQuery = pageQuery.extend({
  action: z.string().trim().max(60).optional(),
  actorId: z.coerce.number().int().positive().optional(),
  targetType: z.string().trim().max(40).optional(),
  targetId: z.string().trim().max(40).optional(),
});

/** Everything under /api/steward: one role guard in front of all of it. */
export function stewardRouter(ctx: AppContext): Router {
  const router = Router();
  router.use(requireRole('steward'));

  router.get('/users', async (req, res) => {
    const query = parseOr400(usersQuery, req.query);
    const { items, total } = await usersRepository.list(query);
    res.json({
      items: items.map((u) => toStewardUser(u)),
      total,
      page: query.page,
      pageSize: query.pageSize,
    });
  });

  router.patch('/users/:id', async (req, res) => {
    const id = parseId(req.params.id, 'That person');
    const change = parseOr400(userChangeSchema, req.body);
    res.json(await changeUser(ctx, requireUser(req).id, id, change));
  });

  router.get('/audit', async (req, res) => {
    const query = parseOr400(auditQuery, req.query);
    const { items, total } = await auditRepository.list(query);
    res.json({ items, total, page: query.page, pageSize: query.pageSize });
  });

  // Field notes taken out of the Field Library and still held out, latest first.
  router.get('/library-holds', async (req, res) => {
    const query = parseOr400(pageQuery, req.query);
    const { items, total } = await closingRepository.listLibraryHolds(query.page, query.pageSize);
    res.json({ items, total, page: query.page, pageSize: query.pageSize });
  });

  router.get('/metrics', async (req, res) => {
    const { from, to } = parseOr400(metricsQuerySchema, req.query);
    res.json(await communityMetrics(from, to));
  });

  router.use('/mentor-applications', stewardApplicationsRouter(ctx));
  router.use(stewardModerationRouter(ctx));
  router.use('/mail', mailRouter(ctx));
  return router;
}
