// Growers apply to mentor; a steward approves or declines. Approval changes the role in the
// same transaction as the decision, and the applicant's e-mail is queued there too, so the
// three never disagree. Open sessions see the new role on their next request (users are read
// fresh per request).
import type { z } from 'zod';
import type { applicationDecisionSchema, mentorApplicationSchema } from '../../../shared/steward-schemas';
import { labelOf, STAGES } from '../../../shared/vocabulary';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { conflict, forbidden, notFound } from '../../lib/errors';
import { log } from '../../lib/logger';
import { audit } from '../audit/audit';
import { enqueueMail } from '../mail/outbox';
import { announceUserChange, setRoleInTransaction } from '../steward/people.service';
import { forSteward, mentorApplicationsRepository, withoutInternals } from './mentor-applications.repository';

export async function applyToMentor(user: Express.User, input: z.output<typeof mentorApplicationSchema>) {
  if (user.role !== 'grower') throw forbidden(`You are already a ${user.role}; only growers apply to mentor.`);
  const id = await getSequelize().transaction(async (transaction) => {
    const created = await mentorApplicationsRepository.insertPending({ userId: user.id, ...input }, transaction);
    if (created === null) throw conflict('application_pending', 'You already have an application waiting for a steward.');
    await audit(user.id, 'mentor_application.submitted', { type: 'mentor_application', id: created }, { stages: input.stages }, transaction);
    return created;
  });
  const application = await mentorApplicationsRepository.findById(id);
  return withoutInternals(application!);
}

function decisionMail(ctx: AppContext, name: string, decision: 'approved' | 'declined', note: string, steward: string, stages: string[]) {
  const noteBlock = note ? `\n${steward} wrote:\n\n  ${note.replace(/\n/g, '\n  ')}\n` : '';
  if (decision === 'approved') {
    return {
      subject: 'You are now a Sporewell mentor',
      text:
        `Hello ${name},\n\n${steward} approved your application to mentor (${stages.join(', ')}). ` +
        `Your account is a mentor account from now on; you do not need to sign in again.\n${noteBlock}\n` +
        `Cases waiting for a mentor are on your rounds: ${ctx.config.publicUrl}/rounds\n\n` +
        `Advice on Sporewell comes from community members. When a batch smells putrid or grows black, pink or slime, ` +
        `tell the grower to discard it, and point growers to local codes and licensed agronomists for inputs on food crops.\n`,
    };
  }
  return {
    subject: 'About your application to mentor on Sporewell',
    text:
      `Hello ${name},\n\n${steward} did not approve your application to mentor this time.\n${noteBlock}\n` +
      `You are welcome to apply again when you have more batches behind you: ${ctx.config.publicUrl}/apply-to-mentor\n`,
  };
}

export async function decideApplication(ctx: AppContext, steward: Express.User, applicationId: number, input: z.output<typeof applicationDecisionSchema>) {
  const { decision, note } = input;
  const sequelize = getSequelize();
  const outcome = await sequelize.transaction(async (transaction) => {
    const application = await mentorApplicationsRepository.findById(applicationId, { lock: true, transaction });
    if (!application) throw notFound('That application');
    if (application.status !== 'pending') {
      throw conflict('already_decided', `This application was already ${application.status}${application.decidedBy ? ` by ${application.decidedBy.displayName}` : ''}.`);
    }
    if (decision === 'approved' && application.applicantDisabled) {
      throw conflict('applicant_disabled', 'This account is disabled. Enable it before approving, or decline.');
    }
    await mentorApplicationsRepository.decide(applicationId, { status: decision, decidedBy: steward.id, note }, transaction);
    await audit(steward.id, `mentor_application.${decision}`, { type: 'mentor_application', id: applicationId }, { applicantId: application.applicant.id, note }, transaction);
    // Only a grower becomes a mentor; someone already made a mentor or steward by hand keeps that.
    const roleChange =
      decision === 'approved' && application.applicant.role === 'grower'
        ? await setRoleInTransaction(steward.id, application.applicant.id, 'mentor', transaction, `mentor application ${applicationId}`)
        : null;
    // A disabled account gets no mail (as everywhere else): it could not act on it, and a
    // steward may have turned it off for a reason the mail would step around.
    if (!application.applicantDisabled) {
      const mail = decisionMail(
        ctx,
        application.applicant.displayName,
        decision,
        note,
        steward.displayName,
        application.stages.map((s) => labelOf(STAGES, s).split(' — ')[0]),
      );
      await enqueueMail({ to: application.applicant.email, kind: `mentor_application_${decision}`, dedupeKey: `mentor-application:${applicationId}`, ...mail }, transaction);
    }
    return { applicantId: application.applicant.id, roleChange };
  });

  ctx.pokeMail();
  log.security('steward.mentor_application_decided', { actorId: steward.id, applicationId, decision, applicantId: outcome.applicantId });
  if (outcome.roleChange) {
    await announceUserChange(ctx, steward.id, outcome.applicantId, {
      roleChanged: { from: outcome.roleChange.before.role, to: outcome.roleChange.after.role },
      disabledChanged: null,
    });
  }
  const application = await mentorApplicationsRepository.findById(applicationId);
  return forSteward(application!);
}
