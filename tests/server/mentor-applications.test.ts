import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { sessionEvents } from '../../server/src/lib/session-events';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { usersRepository } from '../../server/src/modules/users/users.repository';
import { captureLog, JSON_HEADERS, personSignedIn, signedInAgent } from '../factories/steward-data';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const GOOD_APPLICATION = {
  experience: 'Six springs of IMO1 and IMO2 from the beech wood, and FPJ from nettle and comfrey every summer for the allotment.',
  stages: ['IMO1', 'IMO2', 'FPJ'],
  region: 'Lower valley allotments',
};

async function mailTo(email: string) {
  return getSequelize().query<{ subject: string; body_text: string; kind: string }>(
    `SELECT subject, body_text, kind FROM outbox_mail WHERE to_address = :email ORDER BY id`,
    { replacements: { email }, type: QueryTypes.SELECT },
  );
}

async function roleOf(userId: number): Promise<string> {
  const [row] = await getSequelize().query<{ role: string }>(`SELECT role FROM users WHERE id = :userId`, { replacements: { userId }, type: QueryTypes.SELECT });
  return row.role;
}

async function growerWithApplication() {
  const grower = await createUser({ displayName: 'Wren Applicant' });
  const browser = await signedInAgent(t.app, grower);
  const res = await browser.post('/api/mentor-applications').set(JSON_HEADERS).send(GOOD_APPLICATION).expect(201);
  return { grower, browser, application: res.body as { id: number } };
}

describe('POST /api/mentor-applications', () => {
  test('when a grower applies, then 201 with a pending application, and their own list shows it', async () => {
    const { grower, browser, application } = await growerWithApplication();
    expect(application).toMatchObject({
      status: 'pending',
      stages: ['IMO1', 'IMO2', 'FPJ'],
      region: GOOD_APPLICATION.region,
      applicant: { id: grower.id, role: 'grower' },
      decidedBy: null,
    });
    const mine = await browser.get('/api/mentor-applications').expect(200);
    expect(mine.body.items.map((a: { id: number }) => a.id)).toEqual([application.id]);
    // Whether the account is disabled is for stewards; the applicant's own list leaves it out.
    expect(mine.body.items[0].applicant).not.toHaveProperty('disabled');
  });

  test('when a grower applies while one is still pending, then 409 and there is still one', async () => {
    const { browser } = await growerWithApplication();
    const res = await browser.post('/api/mentor-applications').set(JSON_HEADERS).send(GOOD_APPLICATION);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('application_pending');
    expect((await browser.get('/api/mentor-applications')).body.total).toBe(1);
  });

  test('when the experience is too short, no stage is chosen, an unknown stage is sent or the region is missing, then 400 names each field', async () => {
    const { browser } = await personSignedIn(t.app, 'grower');
    const res = await browser.post('/api/mentor-applications').set(JSON_HEADERS).send({ experience: 'Some.', stages: [], region: '' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['experience', 'stages', 'region']));
    const unknown = await browser.post('/api/mentor-applications').set(JSON_HEADERS).send({ ...GOOD_APPLICATION, stages: ['IMO9'] });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)[0]).toMatch(/^stages/);
  });

  test('when signed out, then 401; when a mentor applies, then 403', async () => {
    expect((await agent(t.app).post('/api/mentor-applications').set(JSON_HEADERS).send(GOOD_APPLICATION)).status).toBe(401);
    const { browser } = await personSignedIn(t.app, 'mentor');
    expect((await browser.post('/api/mentor-applications').set(JSON_HEADERS).send(GOOD_APPLICATION)).status).toBe(403);
  });
});

describe('GET /api/steward/mentor-applications', () => {
  test('when a steward filters by pending, then the new application is there with the applicant, and only pending ones', async () => {
    const { grower, application } = await growerWithApplication();
    const { browser } = await personSignedIn(t.app, 'steward');
    const res = await browser.get('/api/steward/mentor-applications?status=pending&pageSize=100').expect(200);
    expect(res.body.items.every((a: { status: string }) => a.status === 'pending')).toBe(true);
    const found = res.body.items.find((a: { id: number }) => a.id === application.id);
    expect(found).toMatchObject({ applicant: { id: grower.id, displayName: 'Wren Applicant', email: grower.email, disabled: false }, experience: GOOD_APPLICATION.experience });
  });

  test('when the status is not one we know, then 400', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    expect((await browser.get('/api/steward/mentor-applications?status=maybe')).status).toBe(400);
  });
});

describe('PATCH /api/steward/mentor-applications/:id', () => {
  test('when a steward approves, then the grower is a mentor at once in their open session, is e-mailed, and the audit log has both steps', async () => {
    const { grower, browser: growerBrowser, application } = await growerWithApplication();
    await growerBrowser.get('/api/steward/users').expect(403);
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    const changed: number[] = [];
    const onChanged = (userId: number) => changed.push(userId);
    sessionEvents.on('user:changed', onChanged);
    const log = captureLog();
    let res;
    try {
      res = await browser.patch(`/api/steward/mentor-applications/${application.id}`).set(JSON_HEADERS).send({ decision: 'approved', note: 'Welcome aboard.' });
      expect(log.lines()).toContainEqual(expect.objectContaining({ level: 'security', event: 'steward.role_changed', userId: grower.id, from: 'grower', to: 'mentor' }));
    } finally {
      log.restore();
      sessionEvents.off('user:changed', onChanged);
    }
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'approved', note: 'Welcome aboard.', decidedBy: { id: steward.id }, decidedAt: expect.any(String) });
    expect(changed).toContain(grower.id);
    expect(await roleOf(grower.id)).toBe('mentor');
    // The grower's session from before the approval, with no new sign-in.
    expect((await growerBrowser.get('/api/auth/me').expect(200)).body.role).toBe('mentor');
    expect(t.mailPokes).toBeGreaterThan(0);
    const mails = await mailTo(grower.email);
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ kind: 'mentor_application_approved', subject: 'You are now a Sporewell mentor' });
    expect(mails[0].body_text).toContain('Welcome aboard.');
    expect(mails[0].body_text).toContain('/rounds');
    const audit = await browser.get(`/api/steward/audit?actorId=${steward.id}`).expect(200);
    expect(audit.body.items.map((a: { action: string }) => a.action)).toEqual(expect.arrayContaining(['mentor_application.approved', 'user.role_changed']));
  });

  test('when a steward approves an application twice, then the second is 409 and nothing changes', async () => {
    const { grower, application } = await growerWithApplication();
    const { browser } = await personSignedIn(t.app, 'steward');
    const first = await browser.patch(`/api/steward/mentor-applications/${application.id}`).set(JSON_HEADERS).send({ decision: 'approved', note: '' }).expect(200);
    const { browser: secondSteward } = await personSignedIn(t.app, 'steward');
    const second = await secondSteward.patch(`/api/steward/mentor-applications/${application.id}`).set(JSON_HEADERS).send({ decision: 'declined', note: 'Changed my mind.' });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('already_decided');
    const again = await browser.get('/api/steward/mentor-applications?status=approved&pageSize=100').expect(200);
    const row = again.body.items.find((a: { id: number }) => a.id === application.id);
    expect(row).toMatchObject({ status: 'approved', decidedBy: first.body.decidedBy, decidedAt: first.body.decidedAt });
    expect(await roleOf(grower.id)).toBe('mentor');
    expect(await mailTo(grower.email)).toHaveLength(1);
  });

  test('when a steward declines with a note, then the grower stays a grower, is e-mailed the note, and may apply again', async () => {
    const { grower, browser: growerBrowser, application } = await growerWithApplication();
    const { browser } = await personSignedIn(t.app, 'steward');
    const res = await browser
      .patch(`/api/steward/mentor-applications/${application.id}`)
      .set(JSON_HEADERS)
      .send({ decision: 'declined', note: 'Come back after a season of LAB.' })
      .expect(200);
    expect(res.body.status).toBe('declined');
    expect(await roleOf(grower.id)).toBe('grower');
    const mails = await mailTo(grower.email);
    expect(mails).toHaveLength(1);
    expect(mails[0].kind).toBe('mentor_application_declined');
    expect(mails[0].body_text).toContain('Come back after a season of LAB.');
    await growerBrowser.post('/api/mentor-applications').set(JSON_HEADERS).send(GOOD_APPLICATION).expect(201);
  });

  test('when the applicant was disabled meanwhile, then approving is 409 and changes nothing, and declining is recorded without mailing them', async () => {
    const { grower, application } = await growerWithApplication();
    await usersRepository.update(grower.id, { disabled: true });
    const { browser } = await personSignedIn(t.app, 'steward');
    const approve = await browser.patch(`/api/steward/mentor-applications/${application.id}`).set(JSON_HEADERS).send({ decision: 'approved', note: '' });
    expect(approve.status).toBe(409);
    expect(approve.body.error.code).toBe('applicant_disabled');
    const pending = await browser.get('/api/steward/mentor-applications?status=pending&pageSize=100').expect(200);
    expect(pending.body.items.find((a: { id: number }) => a.id === application.id).applicant.disabled).toBe(true);
    expect(await roleOf(grower.id)).toBe('grower');
    const decline = await browser
      .patch(`/api/steward/mentor-applications/${application.id}`)
      .set(JSON_HEADERS)
      .send({ decision: 'declined', note: 'Account turned off after the spam reports.' })
      .expect(200);
    expect(decline.body.status).toBe('declined');
    expect(await mailTo(grower.email)).toHaveLength(0);
  });

  test('when a steward declines without a note, or sends an unknown decision, then 400 and the application is still pending', async () => {
    const { application } = await growerWithApplication();
    const { browser } = await personSignedIn(t.app, 'steward');
    const bare = await browser.patch(`/api/steward/mentor-applications/${application.id}`).set(JSON_HEADERS).send({ decision: 'declined' });
    expect(bare.status).toBe(400);
    expect(bare.body.error.fields.note).toBeTruthy();
    const odd = await browser.patch(`/api/steward/mentor-applications/${application.id}`).set(JSON_HEADERS).send({ decision: 'maybe', note: 'x' });
    expect(odd.status).toBe(400);
    expect(odd.body.error.fields.decision).toBeTruthy();
    const list = await browser.get('/api/steward/mentor-applications?status=pending&pageSize=100').expect(200);
    expect(list.body.items.some((a: { id: number }) => a.id === application.id)).toBe(true);
  });

  test('when the application does not exist, then 404', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    expect((await browser.patch('/api/steward/mentor-applications/2000000000').set(JSON_HEADERS).send({ decision: 'approved', note: '' })).status).toBe(404);
  });
});
