// A grower's own applications to mentor (mounted at /api) and the stewards' vetting routes
// (mounted by the steward router under /api/steward, behind its role guard).
import { Router } from 'express';
import { applicationDecisionSchema, applicationStatusSchema, mentorApplicationSchema } from '../../../shared/steward-schemas';
import type { AppContext } from '../../context';
import { pageQuery, parseId, parseOr400, requireSignedIn, requireUser } from '../../lib/http';
import { applyToMentor, decideApplication } from './mentor-applications.service';
import { forSteward, mentorApplicationsRepository, withoutInternals } from './mentor-applications.repository';

export function mentorApplicationsRouter(_ctx: AppContext): Router {
  const router = Router();

  router.post('/mentor-applications', requireSignedIn, async (req, res) => {
    const user = requireUser(req);
    const input = parseOr400(mentorApplicationSchema, req.body);
    res.status(201).json(await applyToMentor(user, input));
  });

  // The signed-in person's own applications, newest decision first, so the form can say where theirs stands.
  router.get('/mentor-applications', requireSignedIn, async (req, res) => {
    const user = requireUser(req);
    const { page, pageSize } = parseOr400(pageQuery, req.query);
    const { items, total } = await mentorApplicationsRepository.list({ userId: user.id, page, pageSize });
    res.json({ items: items.map(withoutInternals), total, page, pageSize });
  });

  return router;
}

const listQuery = pageQuery.extend({ status: applicationStatusSchema.optional() });

export function stewardApplicationsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const query = parseOr400(listQuery, req.query);
    const { items, total } = await mentorApplicationsRepository.list(query);
    res.json({ items: items.map(forSteward), total, page: query.page, pageSize: query.pageSize });
  });

  router.patch('/:id', async (req, res) => {
    const id = parseId(req.params.id, 'That application');
    const input = parseOr400(applicationDecisionSchema, req.body);
    res.json(await decideApplication(ctx, requireUser(req), id, input));
  });

  return router;
}

