// The thread's group commit (server/src/modules/threads/message-writer.ts): posts that arrive
// together are stored by one statement, and each must come out exactly as if it had been
// stored alone — its own seq, its own answer or refusal, the case fields of the last one.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { AppError } from '../../server/src/lib/errors';
import { postMessage, type PostResult } from '../../server/src/modules/threads/messages.service';
import { addThreadPublisher } from '../../server/src/modules/threads/thread-events';
import { makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { caseRow, createThreadCase, messageRows, newClientId } from '../factories/threads';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

/** Stands in for the live layer: these people have the case open, so mentor replies take the batched path. */
function watching(userIds: number[]) {
  return addThreadPublisher({
    publish: async () => undefined,
    messageHidden: () => undefined,
    viewersOf: (caseIds) => new Map(caseIds.map((id) => [id, new Set(userIds)])),
  });
}

const post = (user: Express.User, caseId: number, body: string, extra: { clientId?: string; kind?: 'text' | 'aside' } = {}) =>
  postMessage(t.ctx, user, caseId, { clientId: extra.clientId ?? newClientId(), body, kind: extra.kind ?? 'text' });

const codeOf = (outcome: PromiseSettledResult<PostResult>) =>
  outcome.status === 'fulfilled' ? (outcome.value.duplicate ? 'duplicate' : 'stored') : outcome.reason instanceof AppError ? outcome.reason.code : String(outcome.reason);

describe('posts stored together', () => {
  test('when 60 posts for three cases arrive at once, then each is stored once under its case’s next seq in the order sent, and each case ends as its last post left it', async () => {
    const grower = await createUser({ role: 'grower' });
    const mentor = await createUser({ role: 'mentor' });
    const cases = await Promise.all([0, 1, 2].map(() => createThreadCase({ growerId: grower.id, mentorId: mentor.id, status: 'in_conversation' })));
    const stop = watching([grower.id, mentor.id]);
    try {
      // Post k goes to case k mod 3, from the grower and the mentor by turns; the last post of
      // case 0 is the grower's, those of cases 1 and 2 the mentor's.
      const sent = Array.from({ length: 60 }, (_, k) => ({ caseId: cases[k % 3].id, author: Math.floor(k / 3) % 2 === 0 ? grower : mentor, body: `Post ${k}` }));
      sent[57].author = grower;
      sent[58].author = mentor;
      sent[59].author = mentor;
      const results = await Promise.all(sent.map((p) => post(p.author, p.caseId, p.body)));

      for (const [i, kase] of cases.entries()) {
        const mine = sent.map((p, k) => ({ ...p, result: results[k] })).filter((p) => p.caseId === kase.id);
        // The factory's case holds its opening line as seq 1.
        expect(mine.map((p) => p.result.message.seq)).toEqual(Array.from({ length: 20 }, (_, n) => n + 2));
        for (const p of mine) expect(p.result).toMatchObject({ duplicate: false, message: { body: p.body, caseId: kase.id, author: { id: p.author.id } } });
        const rows = (await messageRows(kase.id)).filter((m) => m.kind === 'text');
        expect(rows.map((m) => [m.seq, m.body])).toEqual(mine.map((p) => [p.result.message.seq, p.body]));
        const row = await caseRow(kase.id);
        expect(row.next_seq).toBe(21);
        expect(row.last_message_preview).toBe(mine.at(-1)!.body);
        expect(row.first_reply_at).not.toBeNull();
        // The grower writing last leaves the clock running; a mentor writing last stops it.
        if (i === 0) expect(row.waiting_since).not.toBeNull();
        else expect(row.waiting_since).toBeNull();
      }
      // Both had the cases open: everything each of them was sent counts as read.
      const reads = await getSequelize().query<{ user_id: number; last_seq: number }>(
        `SELECT user_id, last_seq FROM case_reads WHERE case_id = :id ORDER BY user_id`,
        { replacements: { id: cases[1].id }, type: QueryTypes.SELECT },
      );
      expect(reads).toEqual([
        { user_id: grower.id, last_seq: 21 },
        { user_id: mentor.id, last_seq: 21 },
      ].sort((a, b) => a.user_id - b.user_id));
    } finally {
      stop();
    }
  });

  test('when one write holds a resend, an outsider, a grower’s aside, an ended case, a taken clientId and a disabled account, then each gets its own answer and only the good posts are stored', async () => {
    const grower = await createUser({ role: 'grower' });
    const outsider = await createUser({ role: 'grower' });
    const mentor = await createUser({ role: 'mentor' });
    const gone = await createUser({ role: 'mentor' });
    const open = await createThreadCase({ growerId: grower.id, mentorId: mentor.id, status: 'in_conversation' });
    const ended = await createThreadCase({ growerId: grower.id, status: 'withdrawn' });
    await getSequelize().query(`UPDATE users SET disabled = true WHERE id = :id`, { replacements: { id: gone.id } });
    const stop = watching([grower.id, mentor.id]);
    try {
      const resent = newClientId();
      const noted = newClientId();
      const outcomes = await Promise.allSettled([
        post(grower, open.id, 'First try', { clientId: resent }),
        post(grower, open.id, 'First try', { clientId: resent }),
        post(outsider, open.id, 'Not my case'),
        post(grower, open.id, 'A grower aside', { kind: 'aside' }),
        post(grower, ended.id, 'After the end'),
        post(mentor, ended.id, 'Noted after the end', { kind: 'aside' }),
        post(mentor, open.id, 'Mentor note', { clientId: noted, kind: 'aside' }),
        post(grower, open.id, 'Same id as the note', { clientId: noted }),
        post(gone as Express.User, open.id, 'From a disabled account'),
      ]);
      expect(outcomes.map(codeOf)).toEqual(['stored', 'duplicate', 'not_found', 'forbidden', 'thread_closed', 'stored', 'stored', 'client_id_taken', 'unauthorized']);
      const [first, again] = outcomes as PromiseFulfilledResult<PostResult>[];
      expect(again.value.message).toEqual(first.value.message);
      // The refused ones left no trace: one grower text and one aside, seqs 2 and 3 in the open case.
      expect((await messageRows(open.id)).map((m) => [m.seq, m.kind, m.body])).toEqual([
        [1, 'system', 'The grower opened this case.'],
        [2, 'text', 'First try'],
        [3, 'aside', 'Mentor note'],
      ]);
      expect((await messageRows(ended.id)).map((m) => m.body)).toEqual(['The grower opened this case.', 'Noted after the end']);
    } finally {
      stop();
    }
  });
});

describe('a case held by another transaction', () => {
  test('when another transaction holds a case, then posts for other cases are stored at once, and the held case’s posts wait their turn and keep their order', async () => {
    const grower = await createUser({ role: 'grower' });
    const held = await createThreadCase({ growerId: grower.id });
    const free = await createThreadCase({ growerId: grower.id });
    const sequelize = getSequelize();
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    let locked!: () => void;
    const lockTaken = new Promise<void>((resolve) => (locked = resolve));
    // Stands in for another process's write (or a claim) on the held case.
    const holder = sequelize.transaction(async (transaction) => {
      await sequelize.query(`SELECT id FROM cases WHERE id = :id FOR UPDATE`, { replacements: { id: held.id }, transaction });
      locked();
      await released;
    });
    await lockTaken;
    const waiting = [post(grower, held.id, 'Held one'), post(grower, held.id, 'Held two')];
    const quick = await Promise.race([post(grower, free.id, 'Free one'), new Promise<null>((resolve) => setTimeout(() => resolve(null), 3000))]);
    expect(quick?.message.seq).toBe(2);
    expect((await messageRows(held.id)).map((m) => m.kind)).toEqual(['system']);
    release();
    await holder;
    const [one, two] = await Promise.all(waiting);
    expect([one.message.seq, two.message.seq]).toEqual([2, 3]);
    expect((await messageRows(held.id)).map((m) => m.body)).toEqual(['The grower opened this case.', 'Held one', 'Held two']);
  });
});
