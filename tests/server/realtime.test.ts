// The live thread against a real listening server (startServer), with socket.io-client over
// websocket carrying the session cookie got by signing in over HTTP.
import { describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { sessionEvents } from '../../server/src/lib/session-events';
import { usersRepository } from '../../server/src/modules/users/users.repository';
import { TEST_ORIGIN } from '../setup/test-app';
import { ask, inbox, join, send, since, sleep, useLiveServer, waitFor, type SendAck } from '../setup/live-server';
import { createUser } from '../factories/users';
import { messageRows, newClientId, outboxFor } from '../factories/threads';

const { signIn, person, connect, api, aCase } = useLiveServer();

describe('the handshake', () => {
  test('when there is no session cookie, or a made-up one, then the connection is refused at connect', async () => {
    const refused = await connect(null).catch((e: Error & { data?: { code: string } }) => e);
    expect(refused).toBeInstanceOf(Error);
    expect((refused as Error).message).toBe('Sign in first.');
    expect((refused as { data?: { code: string } }).data?.code).toBe('unauthorized');
    const madeUp = await connect('sporewell.sid=s%3Anot-a-session.abc').catch((e: Error) => e);
    expect((madeUp as Error).message).toBe('Sign in first.');
  });

  test('when the Origin is another site, then even a signed-in handshake is refused (ASVS 4.4.2); our own origin is let in', async () => {
    const { cookie } = await person('grower');
    const refused = await connect(cookie, 'https://elsewhere.example.test').catch((e: Error) => e);
    expect(refused).toBeInstanceOf(Error);
    const ours = await connect(cookie, TEST_ORIGIN);
    expect(ours.connected).toBe(true);
  });

  test('when the person signs out, then that session’s sockets are dropped at once and another session’s stay', async () => {
    const user = await createUser();
    const first = await signIn(user.email);
    const second = await signIn(user.email);
    const a = await connect(first);
    const b = await connect(second);
    const dropped = new Promise<string>((resolve) => a.once('disconnect', (reason) => resolve(reason)));
    expect((await api(first, 'POST', '/api/auth/logout')).status).toBe(204);
    expect(await dropped).toBe('io server disconnect');
    await sleep(100);
    expect(b.connected).toBe(true);
    await expect(connect(first)).rejects.toThrow('Sign in first.');
  });

  test('when an account is disabled, then its sockets are dropped on the change, and an event from one is refused', async () => {
    const mentor = await person('mentor');
    const { caseId } = await aCase();
    const first = await connect(mentor.cookie);
    const second = await connect(mentor.cookie);
    const dropped = new Promise<string>((resolve) => first.once('disconnect', (reason) => resolve(reason)));
    // Without the announcement, the next event re-reads the account and refuses.
    await usersRepository.update(mentor.user.id, { disabled: true });
    const ack = await send(second, caseId, 'Still here?');
    expect(ack).toMatchObject({ ok: false, error: { code: 'unauthorized' } });
    sessionEvents.emit('user:changed', mentor.user.id);
    expect(await dropped).toBe('io server disconnect');
    expect((await messageRows(caseId)).filter((m) => m.kind === 'text')).toHaveLength(0);
  });
});

describe('joining a case', () => {
  test('when an outsider asks to join, then { ok: false } and nothing of the case reaches them', async () => {
    const { grower, caseId } = await aCase();
    const outsider = await connect((await person('grower')).cookie);
    const insider = await connect(grower.cookie);
    const outsiderGot = inbox(outsider);
    const insiderGot = inbox(insider);
    const refused = await join(outsider, caseId);
    expect(refused).toEqual({ ok: false, error: { code: 'not_found', message: 'That case was not found.' } });
    expect((await join(insider, caseId)).ok).toBe(true);
    const mentor = await person('mentor');
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Over HTTP, live to the room.' });
    await waitFor(() => insiderGot.length === 1);
    expect(insiderGot[0].body).toBe('Over HTTP, live to the room.');
    expect(outsiderGot).toHaveLength(0);
    const caughtUp = await since(outsider, caseId, 0);
    expect(caughtUp).toMatchObject({ ok: false, error: { code: 'not_found' } });
  });

  test('when the grower joins, then the ack holds the thread without asides and who is present', async () => {
    const mentor = await person('mentor', 'Bea Hollow');
    const { grower, caseId } = await aCase();
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'ASIDE for mentors only', kind: 'aside' });
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Hello Ada' });
    const socket = await connect(grower.cookie);
    const ack = await join(socket, caseId);
    if (!ack.ok) throw new Error(ack.error.message);
    expect(ack.messages.map((m) => m.kind)).toEqual(['system', 'text']);
    expect(JSON.stringify(ack)).not.toContain('ASIDE');
    expect(ack.presence).toEqual([{ userId: grower.user.id, displayName: 'Ada Fernhill', role: 'grower' }]);
    const mentorSocket = await connect(mentor.cookie);
    const presence = new Promise<number[]>((resolve) => socket.on('presence', (p) => p.present.length === 2 && resolve(p.present.map((e) => e.userId))));
    const mentorAck = await join(mentorSocket, caseId);
    if (!mentorAck.ok) throw new Error(mentorAck.error.message);
    expect(mentorAck.messages.map((m) => m.kind)).toEqual(['system', 'aside', 'text']);
    expect((await presence).sort()).toEqual([grower.user.id, mentor.user.id].sort());
    const gone = new Promise<number[]>((resolve) => socket.on('presence', (p) => p.present.length === 1 && resolve(p.present.map((e) => e.userId))));
    mentorSocket.disconnect();
    expect(await gone).toEqual([grower.user.id]);
  });
});

describe('sending messages', () => {
  test('when the ack arrives, then the message is already in the database', async () => {
    const { grower, caseId } = await aCase();
    const socket = await connect(grower.cookie);
    const clientId = newClientId();
    const inDb = await new Promise<{ ack: unknown; rows: unknown[] }>((resolve) => {
      socket.emit('message:send', { caseId, clientId, body: 'Stored before you hear back.' }, async (ack) => {
        const rows = await getSequelize().query(`SELECT seq, body FROM messages WHERE case_id = :caseId AND client_id = :clientId`, {
          replacements: { caseId, clientId },
          type: QueryTypes.SELECT,
        });
        resolve({ ack, rows });
      });
    });
    expect(inDb.rows).toEqual([{ seq: 2, body: 'Stored before you hear back.' }]);
    expect(inDb.ack).toMatchObject({ ok: true, duplicate: false, message: { seq: 2, clientId, caseId, kind: 'text' } });
  });

  test('when the same clientId is sent twice, then it is stored once and broadcast once', async () => {
    const mentor = await person('mentor');
    const { grower, caseId } = await aCase();
    const sender = await connect(grower.cookie);
    const watcher = await connect(mentor.cookie);
    await join(watcher, caseId);
    const seen = inbox(watcher);
    const clientId = newClientId();
    const payload = { caseId, clientId, body: 'Did this arrive?' };
    const first = await ask<SendAck>(sender, 'message:send', payload);
    const second = await ask<SendAck>(sender, 'message:send', payload);
    expect(first).toMatchObject({ ok: true, duplicate: false });
    expect(second).toMatchObject({ ok: true, duplicate: true });
    if (!first.ok || !second.ok) throw new Error('not ok');
    expect(second.message.id).toBe(first.message.id);
    await send(sender, caseId, 'sentinel');
    await waitFor(() => seen.some((m) => m.body === 'sentinel'));
    expect(seen.filter((m) => m.clientId === clientId)).toHaveLength(1);
    expect((await messageRows(caseId)).filter((m) => m.clientId === clientId)).toHaveLength(1);
  });

  test('when a mentor writes asides and types one, then a grower socket never receives them; another mentor does', async () => {
    const mentor = await person('mentor', 'Bea Hollow');
    const colleague = await person('mentor');
    const { grower, caseId } = await aCase();
    const growerSocket = await connect(grower.cookie);
    const mentorSocket = await connect(mentor.cookie);
    const colleagueSocket = await connect(colleague.cookie);
    for (const s of [growerSocket, mentorSocket, colleagueSocket]) await join(s, caseId);
    const growerGot = inbox(growerSocket);
    const colleagueGot = inbox(colleagueSocket);
    const growerTyping: unknown[] = [];
    growerSocket.on('typing', (p) => growerTyping.push(p));
    const colleagueTyping: unknown[] = [];
    colleagueSocket.on('typing', (p) => colleagueTyping.push(p));

    mentorSocket.emit('typing', { caseId, typing: true, aside: true });
    expect(await send(mentorSocket, caseId, 'ASIDE one over the socket', { kind: 'aside' })).toMatchObject({ ok: true });
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'ASIDE two over HTTP', kind: 'aside' });
    // A grower socket may not write an aside either.
    expect(await send(growerSocket, caseId, 'ASIDE from a grower', { kind: 'aside' })).toMatchObject({ ok: false, error: { code: 'forbidden' } });
    await send(mentorSocket, caseId, 'Plain reply for everyone');

    await waitFor(() => growerGot.some((m) => m.body === 'Plain reply for everyone'));
    await waitFor(() => colleagueGot.filter((m) => m.kind === 'aside').length === 2);
    expect(growerGot.map((m) => m.kind)).toEqual(['text']);
    expect(JSON.stringify(growerGot)).not.toContain('ASIDE');
    expect(growerTyping).toHaveLength(0);
    expect(colleagueTyping).toEqual([{ caseId, userId: mentor.user.id, displayName: 'Bea Hollow', typing: true }]);
  });

  test('when someone types, then the others in the room hear it and the typist does not', async () => {
    const mentor = await person('mentor');
    const { grower, caseId } = await aCase();
    const growerSocket = await connect(grower.cookie);
    const mentorSocket = await connect(mentor.cookie);
    for (const s of [growerSocket, mentorSocket]) await join(s, caseId);
    const mentorHeard: unknown[] = [];
    const growerHeard: unknown[] = [];
    mentorSocket.on('typing', (p) => mentorHeard.push(p));
    growerSocket.on('typing', (p) => growerHeard.push(p));
    growerSocket.emit('typing', { caseId, typing: true });
    await waitFor(() => mentorHeard.length === 1);
    expect(mentorHeard[0]).toEqual({ caseId, userId: grower.user.id, displayName: 'Ada Fernhill', typing: true });
    await sleep(50);
    expect(growerHeard).toHaveLength(0);
  });

  test('when payloads are bad, then each gets a { ok: false, error } ack and the server carries on', async () => {
    const { grower, caseId } = await aCase();
    const socket = await connect(grower.cookie);
    expect(await ask(socket, 'case:join', 'not an object')).toMatchObject({ ok: false, error: { code: 'invalid_input' } });
    expect(await ask(socket, 'case:join', { caseId: -3 })).toMatchObject({ ok: false, error: { code: 'invalid_input' } });
    expect(await ask(socket, 'message:send', {})).toMatchObject({ ok: false, error: { code: 'invalid_input' } });
    expect(await send(socket, caseId, 'z'.repeat(5001))).toMatchObject({ ok: false, error: { code: 'invalid_input' } });
    expect(await send(socket, caseId, '   ')).toMatchObject({ ok: false, error: { code: 'invalid_input' } });
    expect(await send(socket, 99_999_999, 'Nowhere')).toMatchObject({ ok: false, error: { code: 'not_found' } });
    // No ack function at all, and a typing event for a room never joined: ignored, not a crash.
    const raw = socket as unknown as { emit(event: string, payload: unknown): void };
    raw.emit('message:send', { caseId, clientId: newClientId(), body: 'fire and forget' });
    raw.emit('typing', { caseId: 'x' });
    expect(await send(socket, caseId, 'Still answering')).toMatchObject({ ok: true });
    expect(socket.connected).toBe(true);
  });
});

describe('catching up after a drop', () => {
  test('when a client was away while 5 messages came, then message:since gives all 5, in order, none twice', async () => {
    const mentor = await person('mentor');
    const { grower, caseId } = await aCase();
    const before = await connect(grower.cookie);
    const joined = await join(before, caseId);
    if (!joined.ok) throw new Error(joined.error.message);
    const lastSeq = joined.messages.at(-1)!.seq;
    before.disconnect();

    const mentorSocket = await connect(mentor.cookie);
    for (let i = 1; i <= 5; i += 1) expect(await send(mentorSocket, caseId, `missed ${i}`)).toMatchObject({ ok: true });

    const after = await connect(grower.cookie);
    const caughtUp = await since(after, caseId, lastSeq);
    if (!caughtUp.ok) throw new Error(caughtUp.error.message);
    expect(caughtUp.messages.map((m) => m.body)).toEqual(['missed 1', 'missed 2', 'missed 3', 'missed 4', 'missed 5']);
    const seqs = caughtUp.messages.map((m) => m.seq);
    expect(new Set(seqs).size).toBe(5);
    expect([...seqs].sort((a, b) => a - b)).toEqual(seqs);
    expect(seqs[0]).toBeGreaterThan(lastSeq);
    expect(caughtUp.hasMore).toBe(false);
    // Rejoining from the same point answers the same five.
    const rejoined = await join(after, caseId, lastSeq);
    if (!rejoined.ok) throw new Error(rejoined.error.message);
    expect(rejoined.messages.map((m) => m.seq)).toEqual(seqs);
  });
});

describe('the live side of workflow, unread and mail', () => {
  test('when a mentor claims over HTTP, then the room hears case:updated and the system line', async () => {
    const mentor = await person('mentor', 'Bea Hollow');
    const { grower, caseId } = await aCase();
    const socket = await connect(grower.cookie);
    await join(socket, caseId);
    const got = inbox(socket);
    const updated = new Promise<unknown>((resolve) => socket.once('case:updated', resolve));
    expect((await api(mentor.cookie, 'POST', `/api/cases/${caseId}/claim`)).status).toBe(200);
    expect(await updated).toMatchObject({ caseId, status: 'in_conversation', mentorId: mentor.user.id, urgency: expect.any(Number), urgencyLevel: expect.any(String) });
    await waitFor(() => got.length === 1);
    expect(got[0]).toMatchObject({ kind: 'system', body: 'Bea Hollow took this case.' });
  });

  test('when the grower is viewing the case, then a mentor reply sends no mail and leaves nothing unread', async () => {
    const mentor = await person('mentor');
    const { grower, caseId } = await aCase();
    const socket = await connect(grower.cookie);
    await join(socket, caseId);
    const got = inbox(socket);
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'You are here, so no mail.' });
    await waitFor(() => got.length === 1);
    expect(await outboxFor(grower.user.email, 'mentor_reply')).toHaveLength(0);
    await sleep(50);
    expect(await (await api(grower.cookie, 'GET', '/api/cases/unread')).json()).toEqual({ total: 0, byCase: {} });
  });

  test('when the grower is connected but not in the case, then a mentor reply sends them an unread hint and a mail', async () => {
    const mentor = await person('mentor');
    const { grower, caseId } = await aCase();
    const socket = await connect(grower.cookie);
    const hint = new Promise<unknown>((resolve) => socket.once('unread', resolve));
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Come and look.' });
    expect(await hint).toEqual({ caseId });
    expect(await (await api(grower.cookie, 'GET', '/api/cases/unread')).json()).toEqual({ total: 1, byCase: { [String(caseId)]: 1 } });
    expect(await outboxFor(grower.user.email, 'mentor_reply')).toHaveLength(1);
  });
});
