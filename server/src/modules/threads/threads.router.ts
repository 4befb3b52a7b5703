// The thread and workflow routes, mounted at /api/cases before the cases router. The fixed
// paths (/unread, /preferences/...) come first so no `/:id` route can take them; every route
// here carries its own guard, so requests meant for the cases router pass through untouched.
import { Router, type RequestHandler, type Response } from 'express';
import { z } from 'zod';
import { caseStatusSchema } from '../../../shared/case-status-schemas';
import { sendMessageSchema } from '../../../shared/socket-events';
import type { AppContext } from '../../context';
import { parseId, parseOr400, requireRole, requireSignedIn, requireUser } from '../../lib/http';
import { seesAsides } from '../cases/case-access';
import { usersRepository, type MailChoiceColumn } from '../users/users.repository';
import { messagesRepository } from './messages.repository';
import { listMessages, postMessage } from './messages.service';
import { publishChange } from './thread-events';
import { claimCase, handOverCase, moveCase, type WorkflowResult } from './workflow.service';

const messagesQuery = z.object({ after: z.coerce.number({ error: 'Give a whole number.' }).int().min(0).max(2_147_483_647).optional() });
const postBody = sendMessageSchema.omit({ caseId: true });
const handOverBody = z.object({ mentorId: z.number({ error: 'Choose a mentor.' }).int().positive() });
const statusBody = z.object({ status: caseStatusSchema });
const mailChoiceBody = z.object({ on: z.boolean({ error: 'Say true or false.' }) });

const staffOnly = requireRole('mentor', 'steward');
const MAIL_CHOICES: { path: string; column: MailChoiceColumn; guard: RequestHandler }[] = [
  // urgent cases nobody took (urgent-watcher.ts), off unless asked for
  { path: 'urgent-mail', column: 'urgent', guard: staffOnly },
  // a grower's post left unread on a case the mentor holds (grower-wrote-watcher.ts), on unless turned off
  { path: 'grower-wrote-mail', column: 'growerWrote', guard: staffOnly },
  // a mentor's reply while the grower is away (messages.service.ts), for anyone with a case, on unless turned off
  { path: 'reply-mail', column: 'mentorReplied', guard: requireSignedIn },
];

export function threadsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/unread', requireSignedIn, async (req, res) => {
    const user = requireUser(req);
    // Asides count for mentors and stewards, never on a case they opened as its grower (the query sees to that).
    const byCase = await messagesRepository.unreadByCase(user.id, seesAsides(user));
    const total = Object.values(byCase).reduce((sum, n) => sum + n, 0);
    res.json({ total, byCase });
  });

  // The mail choices, each a GET and a PATCH { on } of its own.
  for (const { path, column, guard } of MAIL_CHOICES) {
    router.get(`/preferences/${path}`, guard, async (req, res) => {
      res.json({ on: await usersRepository.mailChoice(requireUser(req).id, column) });
    });
    router.patch(`/preferences/${path}`, guard, async (req, res) => {
      const { on } = parseOr400(mailChoiceBody, req.body);
      res.json({ on: await usersRepository.setMailChoice(requireUser(req).id, column, on) });
    });
  }

  router.get('/:id/messages', requireSignedIn, async (req, res) => {
    const caseId = parseId(req.params.id, 'That case');
    const { after } = parseOr400(messagesQuery, req.query);
    const page = await listMessages(requireUser(req), caseId, { afterSeq: after ?? 0 });
    res.json({ items: page.items, hasMore: page.hasMore });
  });

  router.post('/:id/messages', requireSignedIn, async (req, res) => {
    const caseId = parseId(req.params.id, 'That case');
    const input = parseOr400(postBody, req.body);
    const result = await postMessage(ctx, requireUser(req), caseId, input);
    if (result.change) await publishChange(result.change);
    res.status(result.duplicate ? 200 : 201).json(result.message);
  });

  router.post('/:id/claim', requireRole('mentor', 'steward'), async (req, res) => {
    const caseId = parseId(req.params.id, 'That case');
    await answer(res, await claimCase(requireUser(req), caseId));
  });

  router.post('/:id/hand-over', requireRole('mentor', 'steward'), async (req, res) => {
    const caseId = parseId(req.params.id, 'That case');
    const { mentorId } = parseOr400(handOverBody, req.body);
    await answer(res, await handOverCase(requireUser(req), caseId, mentorId));
  });

  router.post('/:id/status', requireSignedIn, async (req, res) => {
    const caseId = parseId(req.params.id, 'That case');
    const { status } = parseOr400(statusBody, req.body);
    await answer(res, await moveCase(requireUser(req), caseId, status));
  });

  return router;
}

async function answer(res: Response, result: WorkflowResult): Promise<void> {
  if (result.change) await publishChange(result.change);
  res.json({ ...result.state, systemMessage: result.systemMessage });
}
