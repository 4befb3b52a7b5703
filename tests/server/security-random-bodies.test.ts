// Property test: random JSON bodies thrown at every JSON route that takes a body, as the people
// who may call it. Whatever the body, the answer is never a 500, and nothing half-written is left
// behind (ASVS 5.1 input validation; QUALITY.md "bad input").
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { createUser, FACTORY_PASSWORD } from '../factories/users';
import { createBatch, createCase } from '../factories/cases';

let t: TestApp;
type Agent = ReturnType<typeof agent>;
const as: Record<'grower' | 'mentor' | 'steward', Agent> = {} as never;
let caseId = 0;
let batchId = 0;
let growerId = 0;

beforeAll(async () => {
  t = makeTestApp();
  for (const role of ['grower', 'mentor', 'steward'] as const) {
    const user = await createUser({ role });
    as[role] = agent(t.app);
    await as[role].post('/api/auth/login').set({ 'Content-Type': 'application/json', Origin: TEST_ORIGIN }).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
    if (role === 'grower') {
      growerId = user.id;
      batchId = (await createBatch(user.id)).id;
      caseId = await createCase(user.id, { batchId });
    }
  }
});
afterAll(async () => {
  await t?.close();
});

// [method, path, who] — routes that read a JSON body. Sign-in and join are left to their own
// tests: thousands of random sign-ins would only exercise the throttle.
const targets = (): [string, string, keyof typeof as][] => [
  ['POST', '/api/batch-check', 'grower'],
  ['POST', '/api/batches', 'grower'],
  ['PATCH', `/api/batches/${batchId}`, 'grower'],
  ['POST', '/api/cases', 'grower'],
  ['POST', '/api/cases/similar', 'grower'],
  ['POST', `/api/cases/${caseId}/messages`, 'grower'],
  ['POST', `/api/cases/${caseId}/status`, 'mentor'],
  ['POST', `/api/cases/${caseId}/hand-over`, 'steward'],
  ['POST', `/api/cases/${caseId}/close`, 'steward'],
  ['POST', `/api/cases/${caseId}/recovery-report`, 'grower'],
  ['POST', `/api/cases/${caseId}/consent`, 'grower'],
  ['PATCH', '/api/cases/preferences/urgent-mail', 'mentor'],
  ['PATCH', '/api/cases/preferences/grower-wrote-mail', 'mentor'],
  ['PATCH', '/api/cases/preferences/reply-mail', 'grower'],
  ['PATCH', '/api/mentors/me', 'mentor'],
  ['POST', '/api/mentor-applications', 'grower'],
  ['PATCH', '/api/steward/users/999999', 'steward'],
  ['PATCH', '/api/steward/mentor-applications/999999', 'steward'],
  ['POST', '/api/steward/messages/999999/hide', 'steward'],
  ['POST', '/api/steward/messages/999999/show', 'steward'],
  ['POST', '/api/library/no-such-note/take-down', 'steward'],
  ['POST', '/api/auth/password-reset', 'grower'],
  ['PATCH', '/api/auth/me', 'grower'],
  ['POST', '/api/auth/password', 'grower'],
  ['POST', '/api/auth/verify-email', 'grower'],
];

// Bodies: any JSON value, or an object whose keys are the field names the routes use, with any
// values — the second reaches deeper into the validators than random keys would.
const FIELDS = ['stage', 'culture', 'sugar', 'sugarType', 'moisturePct', 'containerWeight', 'label', 'madeOn', 'symptoms', 'title',
  'description', 'numbers', 'batchId', 'clientId', 'body', 'kind', 'status', 'mentorId', 'cause', 'remedy', 'summary', 'outcome',
  'stars', 'consentToPublish', 'on', 'about', 'finishedOn', 'currentPassword', 'experience', 'stages', 'region', 'role', 'disabled', 'decision', 'note', 'token', 'password',
  'value', 'unit', 'published', 'urgency', 'growerId'];
const fieldValue = fc.oneof(
  fc.jsonValue(),
  fc.string({ maxLength: 300 }),
  fc.double(),
  fc.integer(),
  fc.constantFrom('IMO2', 'g', 'lb', 'bubbling', 'brown', 'recovered', 'withdrawn', 'steward', '', ' ', '\u0000', '<script>alert(1)</script>'),
  fc.record({ value: fc.oneof(fc.double(), fc.integer(), fc.string()), unit: fc.oneof(fc.constantFrom('g', 'kg', 'oz', 'lb'), fc.string()) }),
);
const body = fc.oneof(fc.jsonValue(), fc.dictionary(fc.constantFrom(...FIELDS), fieldValue, { maxKeys: 8 }));

describe('random bodies at the JSON routes', () => {
  test('when 10,000 random bodies are sent, then none gets a 500 and no half-record is left', async () => {
    const routes = targets();
    const statuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(fc.nat({ max: routes.length - 1 }), body, async (i, payload) => {
        const [method, path, who] = routes[i];
        const req = method === 'PATCH' ? as[who].patch(path) : as[who].post(path);
        const res = await req.set({ 'Content-Type': 'application/json', Origin: TEST_ORIGIN }).send(JSON.stringify(payload) ?? 'null');
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        return res.status < 500;
      }),
      { numRuns: 10_000 },
    );
    expect(statuses.has(500)).toBe(false);
    // Every case this grower opened keeps its opening line; no message sits past its case's sequence.
    const orphans = await getSequelize().query(
      `SELECT c.id FROM cases c WHERE c.grower_id = :growerId AND NOT EXISTS (SELECT 1 FROM messages m WHERE m.case_id = c.id AND m.seq = 1)
       UNION ALL SELECT m.case_id FROM messages m JOIN cases c ON c.id = m.case_id WHERE c.grower_id = :growerId AND m.seq > c.next_seq`,
      { replacements: { growerId }, type: QueryTypes.SELECT },
    );
    const [{ opened }] = await getSequelize().query<{ opened: string }>(`SELECT count(*) AS opened FROM cases WHERE grower_id = :growerId`, {
      replacements: { growerId },
      type: QueryTypes.SELECT,
    });
    // Some random bodies are valid cases: the check above had something to look at.
    expect(Number(opened)).toBeGreaterThanOrEqual(1);
    expect(orphans).toEqual([]);
  }, 600_000);
});
