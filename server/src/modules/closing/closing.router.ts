// Closing a case and what follows it (PRODUCT.md screens 6–7). Mounted under /api/cases:
//   GET  /:id/closing          who may read the case  → ClosingState (with what the asker may do)
//   POST /:id/close            the holding mentor or a steward  { cause, causeNotes?, remedy, remedyNotes?, summary, askToPublish?, redactTerms?, checkInDays? }
//   POST /:id/recovery-report  the case's grower, once  { outcome, stars, comment?, consentToPublish, consentPhotos?, photoIds? }
//   POST /:id/consent          the case's grower  { consentToPublish, consentPhotos? }
//   POST /:id/publish          the holding mentor or a steward, with the grower's consent  { redactTerms? }
//   POST /:id/close-as-lost    a steward, 14 days after closing with no report
// Each answers the case's ClosingState after the change.
import { Router } from 'express';
import { closeCaseSchema, consentSchema, publishSchema, recoveryReportSchema } from '../../../shared/closing-schemas';
import type { AppContext } from '../../context';
import { parseId, parseOr400, requireUser } from '../../lib/http';
import { changeConsent, closeAsLost, closeCase, fileRecoveryReport, getClosingState, republish } from './closing.service';

export function closingRouter(ctx: AppContext): Router {
  const router = Router();
  const caseIdOf = (value: unknown) => parseId(value, 'That case');

  router.get('/:id/closing', async (req, res) => {
    const user = requireUser(req);
    res.json(await getClosingState(user, caseIdOf(req.params.id)));
  });

  router.post('/:id/close', async (req, res) => {
    const user = requireUser(req);
    const caseId = caseIdOf(req.params.id);
    const values = parseOr400(closeCaseSchema, req.body, 'The closing needs a few fixes.');
    res.json(await closeCase(ctx, user, caseId, values));
  });

  router.post('/:id/recovery-report', async (req, res) => {
    const user = requireUser(req);
    const caseId = caseIdOf(req.params.id);
    const report = parseOr400(recoveryReportSchema, req.body, 'The recovery report needs a few fixes.');
    res.status(201).json(await fileRecoveryReport(ctx, user, caseId, report));
  });

  router.post('/:id/consent', async (req, res) => {
    const user = requireUser(req);
    const caseId = caseIdOf(req.params.id);
    res.json(await changeConsent(ctx, user, caseId, parseOr400(consentSchema, req.body)));
  });

  router.post('/:id/publish', async (req, res) => {
    const user = requireUser(req);
    const caseId = caseIdOf(req.params.id);
    const { redactTerms } = parseOr400(publishSchema, req.body ?? {});
    res.json(await republish(ctx, user, caseId, redactTerms));
  });

  router.post('/:id/close-as-lost', async (req, res) => {
    const user = requireUser(req);
    res.json(await closeAsLost(ctx, user, caseIdOf(req.params.id)));
  });

  return router;
}
