// ASVS 8.2.3: per-field access. A grower sends `role`, `mentorId`, `status`, `published` (and
// ownership fields) along with a good body to every route that takes one; the routes meant for
// growers do their own work and nothing more, the others refuse, and in both cases the grower's
// role, the case's mentor, status and publication, and who owns what stay as the rules say.
// Routes are found by walking the Express router, so a new route that takes a body without a
// row here fails the test.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { listRoutes } from '../setup/list-routes';
import { createBatch, createCase } from '../factories/cases';
import { closeAs, REPORT_BODY } from '../factories/closing';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';
import { insertMessage } from '../factories/steward-data';
import { createUser, FACTORY_PASSWORD, uniqueEmail } from '../factories/users';

type Browser = Awaited<ReturnType<typeof signedIn>>['browser'];
type Row = Record<string, unknown>;

let t: TestApp;
let grower: Awaited<ReturnType<typeof signedIn>>;
let mentor: Awaited<ReturnType<typeof signedIn>>;
let otherMentorId: number;
let otherGrowerId: number;
/** The fields a grower must not set, sent along with every body. */
let extra: Record<string, unknown>;

beforeAll(async () => {
  t = makeTestApp();
  grower = await signedIn(t.app, 'grower');
  mentor = await signedIn(t.app, 'mentor');
  otherMentorId = (await createUser({ role: 'mentor' })).id;
  otherGrowerId = (await createUser()).id;
  extra = {
    role: 'steward',
    mentorId: otherMentorId,
    status: 'recovered',
    published: true,
    growerId: otherGrowerId,
    ownerId: otherGrowerId,
    userId: otherGrowerId,
    authorId: mentor.user.id,
    emailVerified: true,
    disabled: false,
  };
});
/** Rows this file adds to lists other files page through (pending applications, open reports), removed afterwards. */
const made = { applications: [] as number[], reports: [] as number[] };
afterAll(async () => {
  if (grower) {
    const sequelize = getSequelize();
    await sequelize.query(`DELETE FROM message_reports WHERE id IN (:ids) OR reporter_id = :me`, { replacements: { ids: [0, ...made.reports], me: grower.user.id } });
    await sequelize.query(`DELETE FROM mentor_applications WHERE id IN (:ids) OR user_id = :me`, { replacements: { ids: [0, ...made.applications], me: grower.user.id } });
  }
  await t?.close();
});

async function one(sql: string, replacements: Record<string, unknown>): Promise<Row> {
  const [row] = await getSequelize().query<Row>(sql, { replacements, type: QueryTypes.SELECT });
  return row;
}
const caseFields = (id: number) => one(`SELECT grower_id, mentor_id, status, published FROM cases WHERE id = :id`, { id });
const roleOf = async (id: number) => (await one(`SELECT role FROM users WHERE id = :id`, { id })).role;

interface Fixture {
  caseId: number;
  /** what the case must look like afterwards (the route's own, legitimate effect included) */
  caseAfter: Row;
  batchId: number;
  messageId: number;
  applicationId: number;
  reportId: number;
}

/** A case of the grower's in the given state, plus the other things a route may touch (an application and a report only when asked). */
async function fixture(state: 'awaiting' | 'talking' | 'watching' | 'recovered' = 'awaiting', uses: FieldRow['uses'] = []): Promise<Fixture> {
  const me = grower.user.id;
  let caseId: number;
  if (state === 'awaiting') caseId = await createCase(me);
  else if (state === 'recovered') caseId = await createCase(me, { status: 'recovered', mentorId: mentor.user.id, outcome: 'recovered', published: false, waitingSince: null });
  else caseId = await createCase(me, { status: 'in_conversation', mentorId: mentor.user.id, waitingSince: null });
  if (state === 'watching') expect((await closeAs(mentor.browser, caseId, { askToPublish: true })).status).toBe(200);
  const messageId = await insertMessage(caseId, mentor.user.id, 'Stir it once a day.');
  let applicationId = 0;
  if (uses?.includes('application')) {
    const applicant = await createUser();
    const application = await one(`INSERT INTO mentor_applications (user_id, experience, stages, region) VALUES (:id, 'Years of bran piles.', '{IMO3}', 'the lower valley') RETURNING id`, { id: applicant.id });
    made.applications.push((applicationId = Number(application.id)));
  }
  let reportId = 0;
  if (uses?.includes('report')) {
    const report = await one(`INSERT INTO message_reports (message_id, reporter_id, reason) VALUES (:messageId, :reporter, 'Unkind') RETURNING id`, { messageId, reporter: mentor.user.id });
    made.reports.push((reportId = Number(report.id)));
  }
  return { caseId, caseAfter: await caseFields(caseId), batchId: (await createBatch(me)).id, messageId, applicationId, reportId };
}

interface FieldRow {
  state?: 'awaiting' | 'talking' | 'watching' | 'recovered';
  uses?: Array<'application' | 'report'>;
  path: (f: Fixture) => string;
  /** the route's own good body; the forbidden fields are added to it (its own keys win) */
  body?: (f: Fixture) => Record<string, unknown>;
  multipart?: boolean;
  /** a fresh browser (signing in or out must not touch the shared session) */
  browser?: () => Promise<Browser>;
  /** the statuses that mean "done" (or, for routes not meant for growers, "refused") */
  statuses: number[];
  /** the case after the request, where the route legitimately changes it */
  caseAfter?: (f: Fixture) => Row;
  /** what else must hold afterwards */
  check?: (f: Fixture, body: Record<string, unknown>) => Promise<void>;
}

const REFUSED = [403, 404];
const clientId = () => crypto.randomBytes(12).toString('hex');
const fresh = async () => agent(t.app);

const FIELD_ROWS: Record<string, FieldRow> = {
  'POST /api/auth/register': {
    browser: fresh,
    path: () => '/api/auth/register',
    body: () => ({ email: uniqueEmail('fields'), password: 'a-long-register-password', displayName: 'Field Test' }),
    statuses: [201],
    check: async (_f, body) => {
      const made = await one(`SELECT role, email_verified, disabled FROM users WHERE email = :email`, { email: body.email });
      expect(made).toEqual({ role: 'grower', email_verified: false, disabled: false });
    },
  },
  'POST /api/auth/login': { browser: fresh, path: () => '/api/auth/login', body: () => ({ email: grower.user.email, password: FACTORY_PASSWORD }), statuses: [200] },
  'POST /api/auth/logout': {
    browser: async () => (await signedIn(t.app)).browser,
    path: () => '/api/auth/logout',
    statuses: [204],
  },
  'POST /api/auth/verify-email': { path: () => '/api/auth/verify-email', body: () => ({ token: 'x'.repeat(40) }), statuses: [400] },
  'POST /api/auth/verify-email/resend': { path: () => '/api/auth/verify-email/resend', statuses: [202] },
  'PATCH /api/auth/me': { browser: async () => (await signedIn(t.app)).browser, path: () => '/api/auth/me', body: () => ({ displayName: 'Fields Person' }), statuses: [200] },
  'POST /api/auth/password': {
    browser: async () => (await signedIn(t.app)).browser,
    path: () => '/api/auth/password',
    body: () => ({ currentPassword: 'not-the-password', password: 'a-long-new-password' }),
    statuses: [400],
  },
  'POST /api/auth/password-reset/request': { path: () => '/api/auth/password-reset/request', body: () => ({ email: grower.user.email }), statuses: [202] },
  'POST /api/auth/password-reset': { path: () => '/api/auth/password-reset', body: () => ({ token: 'x'.repeat(40), password: 'a-long-new-password' }), statuses: [400] },
  'POST /api/batch-check': {
    path: () => '/api/batch-check',
    body: () => ({ stage: 'IMO2', culture: { value: 900, unit: 'g' }, sugar: { value: 900, unit: 'g' } }),
    statuses: [200],
  },
  'POST /api/batches': {
    path: () => '/api/batches',
    body: () => ({ stage: 'IMO2', label: 'Fields jar', madeOn: '2026-05-01' }),
    statuses: [201],
    check: async () => {
      const latest = await one(`SELECT owner_id FROM batches WHERE label = 'Fields jar' ORDER BY id DESC LIMIT 1`, {});
      expect(latest.owner_id).toBe(grower.user.id);
    },
  },
  'PATCH /api/batches/:id': {
    path: (f) => `/api/batches/${f.batchId}`,
    body: () => ({ notes: 'Moved to the shed.' }),
    statuses: [200],
    check: async (f) => expect((await one(`SELECT owner_id FROM batches WHERE id = :id`, { id: f.batchId })).owner_id).toBe(grower.user.id),
  },
  'POST /api/cases': {
    path: () => '/api/cases',
    body: () => ({ stage: 'FPJ', symptoms: ['bubbling'], title: 'Fields case', description: 'Foam on the juice.' }),
    statuses: [201],
    check: async () => {
      const made = await one(`SELECT grower_id, mentor_id, status, published FROM cases WHERE title = 'Fields case' ORDER BY id DESC LIMIT 1`, {});
      expect(made).toEqual({ grower_id: grower.user.id, mentor_id: null, status: 'awaiting_mentor', published: false });
    },
  },
  'POST /api/cases/similar': { path: () => '/api/cases/similar', body: () => ({ stage: 'IMO2', symptoms: ['bubbling'], description: 'fizzing' }), statuses: [200] },
  'POST /api/cases/:id/messages': {
    path: (f) => `/api/cases/${f.caseId}/messages`,
    body: () => ({ clientId: clientId(), body: 'Still fizzing today.' }),
    statuses: [201],
    check: async (f) => {
      const latest = await one(`SELECT author_id, kind FROM messages WHERE case_id = :id ORDER BY seq DESC LIMIT 1`, { id: f.caseId });
      expect(latest).toEqual({ author_id: grower.user.id, kind: 'text' });
    },
  },
  'POST /api/cases/:id/photos': {
    multipart: true,
    path: (f) => `/api/cases/${f.caseId}/photos`,
    statuses: [201],
    check: async (f) => {
      const photo = await one(`SELECT uploader_id, case_id FROM case_photos WHERE case_id = :id`, { id: f.caseId });
      expect(photo).toEqual({ uploader_id: grower.user.id, case_id: f.caseId });
    },
  },
  // Withdrawing is the grower's own move: the status changes to that, and only that.
  'POST /api/cases/:id/status': {
    state: 'talking',
    path: (f) => `/api/cases/${f.caseId}/status`,
    body: () => ({ status: 'withdrawn' }),
    statuses: [200],
    caseAfter: (f) => ({ ...f.caseAfter, status: 'withdrawn' }),
  },
  // The outcome decides the status; a `status` sent along does not.
  'POST /api/cases/:id/recovery-report': {
    state: 'watching',
    path: (f) => `/api/cases/${f.caseId}/recovery-report`,
    body: () => ({ ...REPORT_BODY, outcome: 'lost', consentToPublish: false }),
    statuses: [201],
    caseAfter: (f) => ({ ...f.caseAfter, status: 'lost' }),
  },
  'POST /api/cases/:id/consent': {
    state: 'recovered',
    path: (f) => `/api/cases/${f.caseId}/consent`,
    body: () => ({ consentToPublish: false }),
    statuses: [200],
  },
  'POST /api/mentor-applications': {
    path: () => '/api/mentor-applications',
    body: () => ({ experience: 'Five years of bran piles and plant juices.', stages: ['IMO3'], region: 'the upper terraces' }),
    statuses: [201],
    check: async () => {
      const application = await one(`SELECT status, decided_by FROM mentor_applications WHERE user_id = :id ORDER BY id DESC LIMIT 1`, { id: grower.user.id });
      expect(application).toEqual({ status: 'pending', decided_by: null });
    },
  },
  'POST /api/messages/:id/reports': {
    path: (f) => `/api/messages/${f.messageId}/reports`,
    body: () => ({ reason: 'This is unkind.' }),
    statuses: [201],
    check: async (f) => {
      expect((await one(`SELECT status FROM message_reports WHERE message_id = :id AND reporter_id = :me`, { id: f.messageId, me: grower.user.id })).status).toBe('open');
      expect((await one(`SELECT hidden FROM messages WHERE id = :id`, { id: f.messageId })).hidden).toBe(false);
    },
  },

  // Not the grower's routes: refused outright, whatever fields come along.
  'PATCH /api/cases/preferences/urgent-mail': { path: () => '/api/cases/preferences/urgent-mail', body: () => ({ on: true }), statuses: REFUSED },
  'PATCH /api/cases/preferences/reply-mail': { path: () => '/api/cases/preferences/reply-mail', body: () => ({ on: true }), statuses: [200] },
  'PATCH /api/cases/preferences/grower-wrote-mail': { path: () => '/api/cases/preferences/grower-wrote-mail', body: () => ({ on: true }), statuses: REFUSED },
  'POST /api/cases/:id/claim': { path: (f) => `/api/cases/${f.caseId}/claim`, statuses: REFUSED },
  'POST /api/cases/:id/hand-over': { state: 'talking', path: (f) => `/api/cases/${f.caseId}/hand-over`, body: () => ({ mentorId: otherMentorId }), statuses: REFUSED },
  'POST /api/cases/:id/close': {
    state: 'talking',
    path: (f) => `/api/cases/${f.caseId}/close`,
    body: () => ({ cause: 'too-little-sugar', remedy: 'add-sugar', summary: 'Closing my own case.', askToPublish: true }),
    statuses: REFUSED,
  },
  'POST /api/cases/:id/publish': { state: 'recovered', path: (f) => `/api/cases/${f.caseId}/publish`, statuses: REFUSED },
  'POST /api/library/:slug/take-down': { path: () => '/api/library/any-field-note/take-down', body: () => ({ reason: 'Taking it out myself.' }), statuses: REFUSED },
  'POST /api/cases/:id/close-as-lost': { state: 'watching', path: (f) => `/api/cases/${f.caseId}/close-as-lost`, statuses: REFUSED },
  'PATCH /api/steward/users/:id': { path: () => `/api/steward/users/${grower.user.id}`, body: () => ({ role: 'steward' }), statuses: REFUSED },
  'PATCH /api/mentors/me': { path: () => '/api/mentors/me', body: () => ({ about: 'I mentor now.' }), statuses: REFUSED },
  'PATCH /api/steward/mentor-applications/:id': {
    uses: ['application'],
    path: (f) => `/api/steward/mentor-applications/${f.applicationId}`,
    body: () => ({ decision: 'approved', note: 'Self-approved.' }),
    statuses: REFUSED,
    check: async (f) => expect((await one(`SELECT status FROM mentor_applications WHERE id = :id`, { id: f.applicationId })).status).toBe('pending'),
  },
  'POST /api/steward/messages/:id/hide': {
    path: (f) => `/api/steward/messages/${f.messageId}/hide`,
    statuses: REFUSED,
    check: async (f) => expect((await one(`SELECT hidden FROM messages WHERE id = :id`, { id: f.messageId })).hidden).toBe(false),
  },
  'POST /api/steward/messages/:id/show': {
    path: (f) => `/api/steward/messages/${f.messageId}/show`,
    statuses: REFUSED,
    check: async (f) => expect((await one(`SELECT hidden FROM messages WHERE id = :id`, { id: f.messageId })).hidden).toBe(false),
  },
  'POST /api/steward/reports/:id/dismiss': {
    uses: ['report'],
    path: (f) => `/api/steward/reports/${f.reportId}/dismiss`,
    statuses: REFUSED,
    check: async (f) => expect((await one(`SELECT status FROM message_reports WHERE id = :id`, { id: f.reportId })).status).toBe('open'),
  },
};

async function call(route: string, row: FieldRow, f: Fixture) {
  const [method] = route.split(' ');
  const client = row.browser ? await row.browser() : grower.browser;
  const verb = method.toLowerCase() as 'post' | 'patch';
  const body = { ...extra, ...(row.body?.(f) ?? {}) };
  let req = client[verb](row.path(f)).set('Origin', TEST_ORIGIN);
  if (row.multipart) {
    for (const [key, value] of Object.entries(extra)) req = req.field(key, String(value));
    const jpeg = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#8a6' } }).jpeg().toBuffer();
    return { res: await req.attach('photos', jpeg, 'jar.jpg'), body };
  }
  return { res: await req.set(JSON_HEADERS).send(body), body };
}

describe('ASVS 8.2.3: a grower cannot set role, mentorId, status or published on any route', () => {
  test('ASVS 8.2.3: when a route takes a body, then it has a row here (and no row names a route that does not exist)', () => {
    const mutating = listRoutes(t.app).filter((r) => !r.startsWith('GET '));
    expect(mutating.filter((r) => !(r in FIELD_ROWS)), 'routes without a row').toEqual([]);
    expect(Object.keys(FIELD_ROWS).filter((r) => !mutating.includes(r)), 'rows without a route').toEqual([]);
  });

  for (const [route, row] of Object.entries(FIELD_ROWS)) {
    test(`ASVS 8.2.3: when a grower adds role, mentorId, status and published to ${route}, then ${row.statuses === REFUSED ? 'it is refused' : 'only the route’s own work is done'} and none of them is set`, async () => {
      const f = await fixture(row.state, row.uses);
      const { res, body } = await call(route, row, f);
      expect(row.statuses, `${route} answered ${res.status} ${JSON.stringify(res.body)}`).toContain(res.status);
      expect(await roleOf(grower.user.id)).toBe('grower');
      expect(await caseFields(f.caseId)).toEqual(row.caseAfter ? row.caseAfter(f) : f.caseAfter);
      await row.check?.(f, body);
    });
  }
});
