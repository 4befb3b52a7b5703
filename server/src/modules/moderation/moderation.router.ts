// Reporting a message (mounted at /api) and the stewards' moderation routes (mounted by the
// steward router under /api/steward, behind its role guard).
import { Router } from 'express';
import { moderationNoteSchema, reportMessageSchema, reportStatusSchema } from '../../../shared/steward-schemas';
import type { AppContext } from '../../context';
import { pageQuery, parseId, parseOr400, requireSignedIn, requireUser } from '../../lib/http';
import { moderationRepository } from './moderation.repository';
import { dismissReport, hideMessage, reportMessage, showMessageAgain } from './moderation.service';

export function moderationRouter(_ctx: AppContext): Router {
  const router = Router();
  router.post('/messages/:id/reports', requireSignedIn, async (req, res) => {
    const user = requireUser(req);
    const messageId = parseId(req.params.id, 'That message');
    const { reason } = parseOr400(reportMessageSchema, req.body);
    const receipt = await reportMessage(user, messageId, reason);
    res.status(receipt.alreadyReported ? 200 : 201).json(receipt);
  });
  return router;
}

const reportsQuery = pageQuery.extend({ status: reportStatusSchema.default('open') });

export function stewardModerationRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/reports', async (req, res) => {
    const query = parseOr400(reportsQuery, req.query);
    const { items, total } = await moderationRepository.listReports(query);
    res.json({ items, total, page: query.page, pageSize: query.pageSize });
  });

  router.post('/messages/:id/hide', async (req, res) => {
    const messageId = parseId(req.params.id, 'That message');
    const { note } = parseOr400(moderationNoteSchema, req.body ?? {});
    res.json(await hideMessage(ctx, requireUser(req), messageId, note));
  });

  router.post('/messages/:id/show', async (req, res) => {
    const messageId = parseId(req.params.id, 'That message');
    const { note } = parseOr400(moderationNoteSchema, req.body ?? {});
    res.json(await showMessageAgain(requireUser(req), messageId, note));
  });

  router.post('/reports/:id/dismiss', async (req, res) => {
    const reportId = parseId(req.params.id, 'That report');
    const { note } = parseOr400(moderationNoteSchema, req.body ?? {});
    res.json(await dismissReport(requireUser(req), reportId, note));
  });

  return router;
}
