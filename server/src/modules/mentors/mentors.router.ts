// Mounted at /api. Holds:
//   GET /api/mentors       mentors and stewards → { items: MentorChoice[], total, page, pageSize }:
//                          the active mentors, for handing a case over (growers 403: the list
//                          of who mentors, and how busy, is staff business)
//   GET /api/mentors/:id   anyone signed in → MentorProfile (404 for anyone who is not a mentor)
//   PATCH /api/mentors/me  mentors and stewards → { about }: what growers read about them there
//   /api/cases/:id/...     the closing routes (server/src/modules/closing/closing.router.ts):
//                          app.ts mounts this router at /api, so closing is mounted from here
//                          rather than by another line in app.ts.
// Mentor applications (POST /api/mentor-applications) have their own router in
// server/src/modules/mentor-applications/.
import { Router } from 'express';
import type { MentorChoiceList } from '../../../shared/library-schemas';
import { mentorAboutSchema } from '../../../shared/steward-schemas';
import type { AppContext } from '../../context';
import { parseId, parseOr400, requireRole, requireSignedIn, requireUser } from '../../lib/http';
import { usersRepository } from '../users/users.repository';
import { closingRouter } from '../closing/closing.router';
import { mentorsRepository } from './mentors.repository';
import { getMentorProfile } from './mentors.service';

export function mentorsRouter(ctx: AppContext): Router {
  const router = Router();
  router.use('/cases', closingRouter(ctx));

  router.get('/mentors', requireRole('mentor', 'steward'), async (_req, res) => {
    const items = await mentorsRepository.listActive();
    res.json({ items, total: items.length, page: 1, pageSize: items.length } satisfies MentorChoiceList);
  });

  router.patch('/mentors/me', requireRole('mentor', 'steward'), async (req, res) => {
    const { about } = parseOr400(mentorAboutSchema, req.body);
    const updated = await usersRepository.update(requireUser(req).id, { about: about === '' ? null : about });
    res.json({ about: updated?.about ?? null });
  });

  router.get('/mentors/:id', requireSignedIn, async (req, res) => {
    res.json(await getMentorProfile(parseId(req.params.id, 'That mentor')));
  });

  return router;
}
