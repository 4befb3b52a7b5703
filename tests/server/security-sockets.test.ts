// ASVS 4.4.2, 8.2.1 and 7.x over the live socket: what realtime.test.ts and
// steward-sockets.test.ts do not already prove. The handshake Origin check on the polling
// transport and without an Origin header; grower B's socket never sends into, hears from or
// borrows from grower A's case; a mentor made a grower loses the case at once; sessions that end
// by password reset or by time take their sockets with them.
import { describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { newPhotoKeys } from '../../server/src/lib/photo-store';
import { casesRepository } from '../../server/src/modules/cases/cases.repository';
import { TEST_ORIGIN } from '../setup/test-app';
import { ask, inbox, join, send, since, sleep, useLiveServer, waitFor, type Client, type SendAck } from '../setup/live-server';
import { createUser } from '../factories/users';
import { createThreadCase, messageRows, newClientId, outboxFor } from '../factories/threads';

const live = useLiveServer();
const { signIn, person, connect, api, aCase } = live;

/** Every event a socket hears, by name. */
function everything(socket: Client): string[] {
  const heard: string[] = [];
  socket.onAny((event: string) => heard.push(event));
  return heard;
}

/** The engine.io opening request of the polling transport, as a browser page would send it. */
function pollingHandshake(headers: Record<string, string>) {
  return fetch(`${live.server.url}/socket.io/?EIO=4&transport=polling&t=${Date.now()}`, { headers });
}

describe('ASVS 4.4.2: the handshake checks where it comes from', () => {
  test('ASVS 4.4.2: when a signed-in polling handshake comes from a foreign Origin, then allowRequest refuses it with 403 and no engine session', async () => {
    const { cookie } = await person('grower');
    const foreign = await pollingHandshake({ cookie, origin: 'https://elsewhere.example.test' });
    expect(foreign.status).toBe(403);
    expect(await foreign.text()).not.toMatch(/"sid"/);
    // The same request from our own origin opens an engine session (the control).
    const ours = await pollingHandshake({ cookie, origin: TEST_ORIGIN });
    expect(ours.status).toBe(200);
    expect(await ours.text()).toMatch(/"sid"/);
    // And through the client library, polling only.
    await expect(connect(cookie, 'https://elsewhere.example.test', { transports: ['polling'] })).rejects.toBeTruthy();
  });

  test('ASVS 4.4.2: when a handshake has no Origin but the browser marks it cross-site, then it is refused; an Origin of "null" is refused too', async () => {
    const { cookie } = await person('grower');
    expect((await pollingHandshake({ cookie, 'sec-fetch-site': 'cross-site' })).status).toBe(403);
    expect((await pollingHandshake({ cookie, origin: 'null' })).status).toBe(403);
    await expect(connect(cookie, undefined, { headers: { 'sec-fetch-site': 'cross-site' } })).rejects.toBeTruthy();
    await expect(connect(cookie, 'null')).rejects.toBeTruthy();
    // A same-origin request without an Origin header (a polling GET may omit it) is let in.
    expect((await pollingHandshake({ cookie, 'sec-fetch-site': 'same-origin' })).status).toBe(200);
  });

  test('ASVS 8.2.1: when a visitor without a session connects over polling, then the namespace refuses it', async () => {
    const refused = await connect(null, TEST_ORIGIN, { transports: ['polling'] }).catch((e: Error & { data?: { code: string } }) => e);
    expect(refused).toBeInstanceOf(Error);
    expect((refused as Error & { data?: { code: string } }).data?.code).toBe('unauthorized');
  });
});

describe("ASVS 8.2.1: grower B's socket and grower A's case", () => {
  test("ASVS 8.2.1/8.2.2: when grower B sends or types into A's case, then the ack says not found, nothing is stored and A's room hears nothing", async () => {
    const { grower: a, caseId } = await aCase();
    const b = await person('grower');
    const aSocket = await connect(a.cookie);
    const aHeard = everything(aSocket);
    await join(aSocket, caseId);
    // A's own arrival is announced to the room (after the ack, through the adapter): wait it out.
    await waitFor(() => aHeard.includes('presence'));
    aHeard.length = 0;
    const bSocket = await connect(b.cookie);
    const before = await messageRows(caseId);

    const sent = await send(bSocket, caseId, 'Let me in on this one.');
    expect(sent).toMatchObject({ ok: false, error: { code: 'not_found' } });
    bSocket.emit('typing', { caseId, typing: true });
    bSocket.emit('typing', { caseId, typing: true, aside: true });
    await sleep(150);
    expect(await messageRows(caseId)).toEqual(before);
    expect(aHeard).toEqual([]);
    expect(bSocket.connected).toBe(true);
  });

  test("ASVS 8.2.1/8.2.2: when a mentor claims, answers and notes an aside on A's case, then B's socket hears nothing at all while A's does", async () => {
    const { grower: a, caseId } = await aCase();
    const b = await person('grower');
    const mentor = await person('mentor');
    const aSocket = await connect(a.cookie);
    const aHeard = everything(aSocket);
    const bSocket = await connect(b.cookie);
    const bHeard = everything(bSocket);
    // B even tries to join first (refused), so a stray room membership would show.
    expect(await join(bSocket, caseId)).toMatchObject({ ok: false, error: { code: 'not_found' } });

    expect((await api(mentor.cookie, 'POST', `/api/cases/${caseId}/claim`)).status).toBe(200);
    expect((await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'ASIDE: looks like the black-mould case', kind: 'aside' })).status).toBe(201);
    expect((await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Add sugar to equal weight.' })).status).toBe(201);
    // A is told (not viewing the case): the case changed and a reply is unread.
    await waitFor(() => aHeard.includes('case:updated') && aHeard.includes('unread'));
    await sleep(100);
    expect(bHeard).toEqual([]);
    // …and B's catch-up for the case is refused too.
    expect(await since(bSocket, caseId, 0)).toMatchObject({ ok: false, error: { code: 'not_found' } });
    expect(await outboxFor(b.user.email)).toEqual([]);
  });

  test("ASVS 8.2.2: when grower B attaches a photo of A's case to a message in B's own case, then it is refused and the photo stays where it was", async () => {
    const { grower: a, caseId: caseA } = await aCase();
    const b = await person('grower');
    const caseB = (await createThreadCase({ growerId: b.user.id })).id;
    const { key, thumbKey } = newPhotoKeys();
    const [photo] = await getSequelize().transaction((transaction) =>
      casesRepository.insertPhotos(caseA, a.user.id, { purpose: 'case', messageId: null }, [{ storageKey: key, thumbKey, width: 10, height: 10, bytes: 100 }], transaction),
    );
    const bSocket = await connect(b.cookie);
    const ack = await send(bSocket, caseB, 'Look at this one', { photoIds: [photo.id] });
    expect(ack).toMatchObject({ ok: false, error: { code: 'invalid_input' } });
    const [row] = await getSequelize().query<{ case_id: number; message_id: number | null }>(`SELECT case_id, message_id FROM case_photos WHERE id = :id`, {
      replacements: { id: photo.id },
      type: QueryTypes.SELECT,
    });
    expect(row).toEqual({ case_id: caseA, message_id: null });
    expect((await messageRows(caseB)).filter((m) => m.kind === 'text')).toEqual([]);
  });

  test('ASVS 8.2.1/8.2.2: when a grower catches up with message:since, then no aside is among the messages; a mentor gets them', async () => {
    const mentor = await person('mentor');
    const { grower, caseId } = await aCase();
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'ASIDE kept among mentors', kind: 'aside' });
    await api(mentor.cookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Visible reply' });
    const growerSocket = await connect(grower.cookie);
    const caught = await since(growerSocket, caseId, 0);
    if (!caught.ok) throw new Error(caught.error.message);
    expect(caught.messages.map((m) => m.kind)).toEqual(['system', 'text']);
    expect(JSON.stringify(caught)).not.toContain('ASIDE');
    const mentorSocket = await connect(mentor.cookie);
    const staff = await since(mentorSocket, caseId, 0);
    if (!staff.ok) throw new Error(staff.error.message);
    expect(staff.messages.map((m) => m.kind)).toEqual(['system', 'aside', 'text']);
  });

  test("ASVS 8.2.1: when a steward makes a mentor a grower, then the mentor's socket in the case drops and, reconnected, cannot join the case or hear asides", async () => {
    const mentor = await person('mentor');
    const colleague = await person('mentor');
    const steward = await person('steward');
    const { caseId } = await aCase();
    const socket = await connect(mentor.cookie);
    expect((await join(socket, caseId)).ok).toBe(true);
    const dropped = new Promise<string>((resolve) => socket.once('disconnect', (reason) => resolve(reason)));
    expect((await api(steward.cookie, 'PATCH', `/api/steward/users/${mentor.user.id}`, { role: 'grower' })).status).toBe(200);
    expect(await dropped).toBe('io server disconnect');

    const again = await connect(mentor.cookie);
    const got = inbox(again);
    expect(await join(again, caseId)).toMatchObject({ ok: false, error: { code: 'not_found' } });
    const colleagueSocket = await connect(colleague.cookie);
    expect(await send(colleagueSocket, caseId, 'ASIDE after the demotion', { kind: 'aside' })).toMatchObject({ ok: true });
    expect(await send(colleagueSocket, caseId, 'A reply after the demotion')).toMatchObject({ ok: true });
    await sleep(150);
    expect(got).toEqual([]);
  });
});

describe('ASVS 7.4.x / 7.3.x: sessions that end take their sockets with them', () => {
  test('ASVS 7.4.3: when the password is reset, then the sockets of every earlier session are dropped and cannot come back', async () => {
    const user = await createUser();
    const phone = await signIn(user.email);
    const laptop = await signIn(user.email);
    const phoneSocket = await connect(phone);
    const laptopSocket = await connect(laptop);
    const drops = [phoneSocket, laptopSocket].map((s) => new Promise<string>((resolve) => s.once('disconnect', (reason) => resolve(reason))));
    expect((await api(null, 'POST', '/api/auth/password-reset/request', { email: user.email })).status).toBe(202);
    const [mail] = await outboxFor(user.email, 'reset_password');
    const token = /reset-password\?token=([A-Za-z0-9_-]+)/.exec(mail?.body_text ?? '')?.[1];
    expect(token).toBeTruthy();
    expect((await api(null, 'POST', '/api/auth/password-reset', { token, password: 'a-fresh-password-after-reset' })).status).toBe(200);
    expect(await Promise.all(drops)).toEqual(['io server disconnect', 'io server disconnect']);
    await expect(connect(phone)).rejects.toThrow('Sign in first.');
    await expect(connect(laptop)).rejects.toThrow('Sign in first.');
  });

  test('ASVS 7.3.1: when the session is idle past its limit, then the next event is refused and the socket dropped', async () => {
    const { grower, caseId } = await aCase();
    const socket = await connect(grower.cookie);
    const dropped = new Promise<string>((resolve) => socket.once('disconnect', (reason) => resolve(reason)));
    await getSequelize().query(`UPDATE session SET expire = now() - interval '1 minute' WHERE (sess -> 'passport' ->> 'user') = :id`, {
      replacements: { id: String(grower.user.id) },
    });
    const ack = await ask<SendAck>(socket, 'message:send', { caseId, clientId: newClientId(), body: 'Still there?' });
    expect(ack).toMatchObject({ ok: false, error: { code: 'unauthorized' } });
    expect(await dropped).toBe('io server disconnect');
    expect((await messageRows(caseId)).filter((m) => m.kind === 'text')).toEqual([]);
  });

  test('ASVS 7.3.2: when the session is older than the absolute limit, then the next event is refused and the socket dropped', async () => {
    const { grower, caseId } = await aCase();
    const socket = await connect(grower.cookie);
    const dropped = new Promise<string>((resolve) => socket.once('disconnect', (reason) => resolve(reason)));
    const hours = live.server.config.SESSION_ABSOLUTE_HOURS + 1;
    await getSequelize().query(
      `UPDATE session SET sess = jsonb_set(sess::jsonb, '{startedAt}', to_jsonb((extract(epoch from now() - make_interval(hours => :hours)) * 1000)::bigint))::json
        WHERE (sess -> 'passport' ->> 'user') = :id`,
      { replacements: { id: String(grower.user.id), hours } },
    );
    expect(await join(socket, caseId)).toMatchObject({ ok: false, error: { code: 'unauthorized' } });
    expect(await dropped).toBe('io server disconnect');
  });
  test('ASVS 7.3.2: when the session is older than the absolute limit, then a new handshake with it is refused', async () => {
    const grower = await person('grower');
    const hours = live.server.config.SESSION_ABSOLUTE_HOURS + 1;
    await getSequelize().query(
      `UPDATE session SET sess = jsonb_set(sess::jsonb, '{startedAt}', to_jsonb((extract(epoch from now() - make_interval(hours => :hours)) * 1000)::bigint))::json
        WHERE (sess -> 'passport' ->> 'user') = :id`,
      { replacements: { id: String(grower.user.id), hours } },
    );
    await expect(connect(grower.cookie)).rejects.toThrow('Sign in first.');
  });

  test('ASVS 7.4.2: when the account is disabled behind a live session, then a new handshake with it is refused', async () => {
    const grower = await person('grower');
    // Straight in the table, as another process or a steward's hand would leave it: nothing in this process hears of it.
    await getSequelize().query(`UPDATE users SET disabled = true WHERE id = :id`, { replacements: { id: grower.user.id } });
    await expect(connect(grower.cookie)).rejects.toThrow('Sign in first.');
  });
});
