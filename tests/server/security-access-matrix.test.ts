// ASVS 8.2.1 / 8.2.2 (4.0.3: 4.2.1): access is checked per function and per object, on the
// server. Every API route × { visitor, grower A, grower B, mentor, steward } → the expected
// status. A cell is an exact status, or 'pass': the request got past the access checks (it may
// still be refused for its content, 400/409, but never 401/403/404). Grower A owns the batch and
// the case; grower B is another grower. The test fails when a route exists without a row.
import crypto from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { listRoutes } from '../setup/list-routes';
import { createUser, FACTORY_PASSWORD } from '../factories/users';
import { createBatch, createCase } from '../factories/cases';
import { insertMessage } from '../factories/steward-data';
import { CLOSE_BODY, REPORT_BODY } from '../factories/closing';

type Who = 'visitor' | 'growerA' | 'growerB' | 'mentor' | 'steward';
const WHO: Who[] = ['visitor', 'growerA', 'growerB', 'mentor', 'steward'];
type Cell = number | 'pass';

interface Fixture {
  batchId: number;
  caseId: number;
  messageId: number;
  photoId: number;
  slug: string;
  mentorId: number;
  otherMentorId: number;
  applicationId: number;
  reportId: number;
  targetUserId: number;
}

interface Row {
  /** A fresh fixture per cell, for requests that change what they touch. */
  fresh?: boolean;
  path: (f: Fixture) => string;
  body?: (f: Fixture) => Record<string, unknown>;
  multipart?: boolean;
  /** Run on a session of its own (signing out would end the shared one). */
  ownSession?: boolean;
  expect: [Cell, Cell, Cell, Cell, Cell];
}

let t: TestApp;
const people: Partial<Record<Who, { id: number; browser: ReturnType<typeof agent> }>> = {};
let shared: Fixture;

async function signIn(role: 'grower' | 'mentor' | 'steward') {
  const user = await createUser({ role });
  const browser = agent(t.app);
  await browser.post('/api/auth/login').set({ 'Content-Type': 'application/json', Origin: TEST_ORIGIN }).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
  return { id: user.id, browser };
}

async function fixture(withPhoto = false): Promise<Fixture> {
  const growerA = people.growerA!.id;
  const mentorId = people.mentor!.id;
  const batch = await createBatch(growerA);
  const caseId = await createCase(growerA, { batchId: batch.id, status: 'in_conversation', mentorId });
  const messageId = await insertMessage(caseId, growerA, 'The jar is fizzing again this morning.');
  const applicant = await createUser({ role: 'grower' });
  const sequelize = getSequelize();
  const [application] = await sequelize.query<{ id: number }>(
    `INSERT INTO mentor_applications (user_id, experience, stages, region) VALUES (:id, 'Ten years of rice cultures.', '{IMO1,IMO2}', 'the lower valley') RETURNING id`,
    { replacements: { id: applicant.id }, type: QueryTypes.SELECT },
  );
  const [report] = await sequelize.query<{ id: number }>(
    `INSERT INTO message_reports (message_id, reporter_id, reason) VALUES (:messageId, :reporter, 'Unkind words') RETURNING id`,
    { replacements: { messageId, reporter: mentorId }, type: QueryTypes.SELECT },
  );
  let photoId = 0;
  if (withPhoto) {
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#7a5' } }).jpeg().toBuffer();
    const res = await people.growerA!.browser.post(`/api/cases/${caseId}/photos`).set('Origin', TEST_ORIGIN).attach('photos', jpeg, 'jar.jpg').expect(201);
    photoId = res.body.photos[0].id;
  }
  return {
    batchId: batch.id,
    caseId,
    messageId,
    photoId,
    slug: shared?.slug ?? 'matrix-guide',
    mentorId,
    otherMentorId: shared?.otherMentorId ?? 0,
    applicationId: application.id,
    reportId: report.id,
    targetUserId: applicant.id,
  };
}

const ANYONE: Row['expect'] = ['pass', 'pass', 'pass', 'pass', 'pass'];
const SIGNED_IN: Row['expect'] = [401, 'pass', 'pass', 'pass', 'pass'];
const STEWARD_ONLY: Row['expect'] = [401, 403, 403, 403, 'pass'];
const STAFF_ONLY: Row['expect'] = [401, 403, 403, 'pass', 'pass'];
/** The case's grower, mentors and stewards; another grower is told the case does not exist. */
const CASE_READERS: Row['expect'] = [401, 'pass', 404, 'pass', 'pass'];
const OWNER_ONLY: Row['expect'] = [401, 'pass', 404, 404, 404];
const clientId = () => crypto.randomBytes(12).toString('hex');

const MATRIX: Record<string, Row> = {
  'GET /api/health': { path: () => '/api/health', expect: ANYONE },
  'GET /api/vocabulary': { path: () => '/api/vocabulary', expect: ANYONE },
  'POST /api/auth/register': { path: () => '/api/auth/register', body: () => ({}), expect: ANYONE },
  'POST /api/auth/login': { path: () => '/api/auth/login', body: () => ({}), expect: ANYONE },
  'POST /api/auth/logout': { ownSession: true, path: () => '/api/auth/logout', expect: ANYONE },
  'GET /api/auth/me': { path: () => '/api/auth/me', expect: SIGNED_IN },
  'PATCH /api/auth/me': { fresh: true, path: () => '/api/auth/me', body: () => ({ displayName: 'Matrix Person' }), expect: SIGNED_IN },
  // A wrong current password: past the access checks, refused for its content (400).
  'POST /api/auth/password': { path: () => '/api/auth/password', body: () => ({ currentPassword: 'not-the-password', password: 'a-long-new-password' }), expect: SIGNED_IN },
  'POST /api/auth/verify-email': { path: () => '/api/auth/verify-email', body: () => ({ token: 'x'.repeat(40) }), expect: ANYONE },
  'POST /api/auth/verify-email/resend': { path: () => '/api/auth/verify-email/resend', expect: SIGNED_IN },
  'POST /api/auth/password-reset/request': { path: () => '/api/auth/password-reset/request', body: () => ({ email: 'nobody@example.test' }), expect: ANYONE },
  'POST /api/auth/password-reset': { path: () => '/api/auth/password-reset', body: () => ({ token: 'x'.repeat(40), password: 'a-long-new-password' }), expect: ANYONE },

  'POST /api/batch-check': { path: () => '/api/batch-check', body: () => ({ stage: 'IMO2', culture: { value: 900, unit: 'g' }, sugar: { value: 900, unit: 'g' } }), expect: ANYONE },
  'GET /api/batches': { path: () => '/api/batches', expect: SIGNED_IN },
  'POST /api/batches': { path: () => '/api/batches', body: () => ({ stage: 'IMO2', label: 'Matrix jar', madeOn: '2026-11-20' }), expect: SIGNED_IN },
  'GET /api/batches/:id': { path: (f) => `/api/batches/${f.batchId}`, expect: OWNER_ONLY },
  'PATCH /api/batches/:id': { fresh: true, path: (f) => `/api/batches/${f.batchId}`, body: () => ({ notes: 'Moved to the shed.' }), expect: OWNER_ONLY },

  'GET /api/cases': { path: () => '/api/cases', expect: SIGNED_IN },
  'POST /api/cases': { path: () => '/api/cases', body: () => ({ stage: 'IMO2', symptoms: ['bubbling'], description: 'Fizzing under the lid.' }), expect: SIGNED_IN },
  'POST /api/cases/similar': { path: () => '/api/cases/similar', body: () => ({ stage: 'IMO2', symptoms: ['bubbling'], description: 'fizzing' }), expect: SIGNED_IN },
  'GET /api/cases/unread': { path: () => '/api/cases/unread', expect: SIGNED_IN },
  'GET /api/cases/preferences/urgent-mail': { path: () => '/api/cases/preferences/urgent-mail', expect: STAFF_ONLY },
  'PATCH /api/cases/preferences/urgent-mail': { path: () => '/api/cases/preferences/urgent-mail', body: () => ({ on: false }), expect: STAFF_ONLY },
  'GET /api/cases/preferences/reply-mail': { path: () => '/api/cases/preferences/reply-mail', expect: SIGNED_IN },
  'PATCH /api/cases/preferences/reply-mail': { path: () => '/api/cases/preferences/reply-mail', body: () => ({ on: true }), expect: SIGNED_IN },
  'GET /api/cases/preferences/grower-wrote-mail': { path: () => '/api/cases/preferences/grower-wrote-mail', expect: STAFF_ONLY },
  'PATCH /api/cases/preferences/grower-wrote-mail': { path: () => '/api/cases/preferences/grower-wrote-mail', body: () => ({ on: true }), expect: STAFF_ONLY },
  'GET /api/cases/:id': { path: (f) => `/api/cases/${f.caseId}`, expect: CASE_READERS },
  'GET /api/cases/:id/similar': { path: (f) => `/api/cases/${f.caseId}/similar`, expect: CASE_READERS },
  'GET /api/cases/:id/messages': { path: (f) => `/api/cases/${f.caseId}/messages`, expect: CASE_READERS },
  'GET /api/cases/:id/closing': { path: (f) => `/api/cases/${f.caseId}/closing`, expect: CASE_READERS },
  'GET /api/cases/:id/photos/:photoId': { path: (f) => `/api/cases/${f.caseId}/photos/${f.photoId}`, expect: [404, 'pass', 404, 'pass', 'pass'] },
  'GET /api/cases/:id/photos/:photoId/thumb': { path: (f) => `/api/cases/${f.caseId}/photos/${f.photoId}/thumb`, expect: [404, 'pass', 404, 'pass', 'pass'] },
  'POST /api/cases/:id/messages': { fresh: true, path: (f) => `/api/cases/${f.caseId}/messages`, body: () => ({ clientId: clientId(), body: 'Any news?' }), expect: CASE_READERS },
  'POST /api/cases/:id/photos': { fresh: true, path: (f) => `/api/cases/${f.caseId}/photos`, multipart: true, expect: CASE_READERS },
  // Claiming and handing over are mentors' and stewards' work: every grower is refused on the
  // role before the case is looked up, so the 403 says nothing about the case.
  'POST /api/cases/:id/claim': { fresh: true, path: (f) => `/api/cases/${f.caseId}/claim`, expect: [401, 403, 403, 'pass', 'pass'] },
  'POST /api/cases/:id/hand-over': { fresh: true, path: (f) => `/api/cases/${f.caseId}/hand-over`, body: (f) => ({ mentorId: f.otherMentorId }), expect: [401, 403, 403, 'pass', 'pass'] },
  // in_conversation → withdrawn is the grower's (or a steward's) move, not a mentor's.
  'POST /api/cases/:id/status': { fresh: true, path: (f) => `/api/cases/${f.caseId}/status`, body: () => ({ status: 'withdrawn' }), expect: [401, 'pass', 404, 403, 'pass'] },
  'POST /api/cases/:id/close': { fresh: true, path: (f) => `/api/cases/${f.caseId}/close`, body: () => ({ ...CLOSE_BODY }), expect: [401, 403, 404, 'pass', 'pass'] },
  'POST /api/cases/:id/recovery-report': { fresh: true, path: (f) => `/api/cases/${f.caseId}/recovery-report`, body: () => ({ ...REPORT_BODY }), expect: [401, 'pass', 404, 403, 403] },
  'POST /api/cases/:id/consent': { fresh: true, path: (f) => `/api/cases/${f.caseId}/consent`, body: () => ({ consentToPublish: false }), expect: [401, 'pass', 404, 403, 403] },
  'POST /api/cases/:id/publish': { fresh: true, path: (f) => `/api/cases/${f.caseId}/publish`, body: () => ({}), expect: [401, 403, 404, 'pass', 'pass'] },
  'POST /api/cases/:id/close-as-lost': { fresh: true, path: (f) => `/api/cases/${f.caseId}/close-as-lost`, body: () => ({}), expect: [401, 403, 404, 403, 'pass'] },

  'GET /api/library': { path: () => '/api/library', expect: ANYONE },
  'GET /api/library/:slug': { path: (f) => `/api/library/${f.slug}`, expect: ANYONE },
  // A guide has no photos: everyone gets the same 404, nobody a 401/403.
  // Curating the library is a steward's (on the shared guide: 409, guides come from files).
  'POST /api/library/:slug/take-down': { path: (f) => `/api/library/${f.slug}/take-down`, body: () => ({ reason: 'It names a farm.' }), expect: [401, 403, 403, 403, 'pass'] },
  'GET /api/library/:slug/photos/:photoId': { path: (f) => `/api/library/${f.slug}/photos/1`, expect: [404, 404, 404, 404, 404] },
  'GET /api/library/:slug/photos/:photoId/thumb': { path: (f) => `/api/library/${f.slug}/photos/1/thumb`, expect: [404, 404, 404, 404, 404] },
  // Who mentors, and how many cases each holds, is for the staff handing a case over.
  'GET /api/mentors': { path: () => '/api/mentors', expect: STAFF_ONLY },
  'GET /api/mentors/:id': { path: (f) => `/api/mentors/${f.mentorId}`, expect: SIGNED_IN },
  'PATCH /api/mentors/me': { path: () => '/api/mentors/me', body: () => ({ about: 'Bran piles and plant juices since the old orchard.' }), expect: STAFF_ONLY },
  'GET /api/mentor-applications': { path: () => '/api/mentor-applications', expect: SIGNED_IN },
  // Only growers apply to mentor.
  'POST /api/mentor-applications': { path: () => '/api/mentor-applications', body: () => ({ experience: 'Five years of bran piles and plant juices.', stages: ['IMO3'], region: 'the upper terraces' }), expect: [401, 'pass', 'pass', 403, 403] },
  'POST /api/messages/:id/reports': { fresh: true, path: (f) => `/api/messages/${f.messageId}/reports`, body: () => ({ reason: 'This is unkind.' }), expect: CASE_READERS },

  'GET /api/steward/users': { path: () => '/api/steward/users', expect: STEWARD_ONLY },
  'PATCH /api/steward/users/:id': { fresh: true, path: (f) => `/api/steward/users/${f.targetUserId}`, body: () => ({ role: 'mentor' }), expect: STEWARD_ONLY },
  'GET /api/steward/audit': { path: () => '/api/steward/audit', expect: STEWARD_ONLY },
  'GET /api/steward/mail': { path: () => '/api/steward/mail', expect: STEWARD_ONLY },
  'GET /api/steward/library-holds': { path: () => '/api/steward/library-holds', expect: STEWARD_ONLY },
  'GET /api/steward/metrics': { path: () => '/api/steward/metrics', expect: STEWARD_ONLY },
  'GET /api/steward/mentor-applications': { path: () => '/api/steward/mentor-applications', expect: STEWARD_ONLY },
  'PATCH /api/steward/mentor-applications/:id': { fresh: true, path: (f) => `/api/steward/mentor-applications/${f.applicationId}`, body: () => ({ decision: 'declined', note: 'Not yet.' }), expect: STEWARD_ONLY },
  'GET /api/steward/reports': { path: () => '/api/steward/reports', expect: STEWARD_ONLY },
  'POST /api/steward/messages/:id/hide': { fresh: true, path: (f) => `/api/steward/messages/${f.messageId}/hide`, body: () => ({}), expect: STEWARD_ONLY },
  'POST /api/steward/messages/:id/show': { fresh: true, path: (f) => `/api/steward/messages/${f.messageId}/show`, body: () => ({}), expect: STEWARD_ONLY },
  'POST /api/steward/reports/:id/dismiss': { fresh: true, path: (f) => `/api/steward/reports/${f.reportId}/dismiss`, body: () => ({}), expect: STEWARD_ONLY },
};

beforeAll(async () => {
  t = makeTestApp();
  people.growerA = await signIn('grower');
  people.growerB = await signIn('grower');
  people.mentor = await signIn('mentor');
  people.steward = await signIn('steward');
  const other = await createUser({ role: 'mentor' });
  await getSequelize().query(
    `INSERT INTO library_entries (slug, kind, title, summary, body, stages) VALUES ('matrix-guide', 'guide', 'Matrix guide', 'A guide', 'Body', '{IMO2}') ON CONFLICT (slug) DO NOTHING`,
  );
  shared = { ...(await fixture(true)), slug: 'matrix-guide', otherMentorId: other.id };
});
afterAll(async () => {
  await t?.close();
});

async function call(who: Who, method: string, row: Row, f: Fixture) {
  const role = who === 'mentor' || who === 'steward' ? who : 'grower';
  const client = who === 'visitor' ? agent(t.app) : row.ownSession ? (await signIn(role)).browser : people[who]!.browser;
  const url = row.path(f);
  const verb = method.toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete';
  let req = client[verb](url).set('Origin', TEST_ORIGIN);
  if (row.multipart) req = req.field('purpose', 'case');
  else if (method !== 'GET') req = req.set('Content-Type', 'application/json').send(JSON.stringify(row.body?.(f) ?? {}));
  return req;
}

describe('ASVS 8.2.1/8.2.2: every route × every kind of person', () => {
  test('when a route exists, then the matrix has a row for it (and no row for a route that does not exist)', () => {
    const routes = listRoutes(t.app);
    expect(routes.filter((r) => !(r in MATRIX)), 'routes without a row').toEqual([]);
    expect(Object.keys(MATRIX).filter((r) => !routes.includes(r)), 'rows without a route').toEqual([]);
  });

  for (const [route, row] of Object.entries(MATRIX)) {
    test(`when each kind of person calls ${route}, then they get ${row.expect.join(' / ')}`, async () => {
      const [method] = route.split(' ');
      const seen: string[] = [];
      const wanted: string[] = [];
      for (const [i, who] of WHO.entries()) {
        const f = row.fresh ? { ...(await fixture()), slug: shared.slug, otherMentorId: shared.otherMentorId, photoId: shared.photoId } : shared;
        const res = await call(who, method, row, f);
        const cell = row.expect[i];
        const ok = cell === 'pass' ? ![401, 403, 404].includes(res.status) && res.status < 500 : res.status === cell;
        seen.push(`${who}: ${res.status}${ok ? '' : ' ✗'}`);
        wanted.push(`${who}: ${cell}`);
      }
      expect(seen.join(', ')).not.toContain('✗');
      expect(seen.length).toBe(wanted.length);
    });
  }

  test('when grower B lists cases, then grower A’s case is not among them', async () => {
    const res = await people.growerB!.browser.get('/api/cases?pageSize=100');
    expect(res.status).toBe(200);
    expect(res.body.items.map((c: { id: number }) => c.id)).not.toContain(shared.caseId);
  });
});
