// A steward's decision reaching the person's open browser: when an application to mentor is
// approved, the applicant's socket is told `account:changed` (so the client asks who it is and
// shows the rounds without a reload) and then dropped, since its rooms were for the old role.
import { describe, expect, test } from 'vitest';
import { useLiveServer, type Client } from '../setup/live-server';

const { api, connect, person } = useLiveServer();

/** What the socket heard, in order, until it was dropped (or the time ran out). */
function heard(socket: Client, ms = 5000): Promise<string[]> {
  const events: string[] = [];
  socket.on('account:changed', () => events.push('account:changed'));
  return new Promise((resolve) => {
    const timer = setTimeout(() => resolve(events), ms);
    socket.on('disconnect', (reason) => {
      clearTimeout(timer);
      resolve([...events, `disconnect:${reason}`]);
    });
  });
}

describe('account changes pushed to the browser', () => {
  test("when a steward approves a grower's application to mentor, then the grower's socket hears account:changed, then is dropped, and /me says mentor", async () => {
    const applicant = await person('grower');
    const steward = await person('steward');
    const applied = await api(applicant.cookie, 'POST', '/api/mentor-applications', {
      experience: 'Eight springs of bran piles and plant juices on the south allotments, taught at the course.',
      stages: ['IMO3', 'FPJ'],
      region: 'South allotments',
    });
    expect(applied.status).toBe(201);
    const { id } = (await applied.json()) as { id: number };

    const socket = await connect(applicant.cookie);
    const events = heard(socket);
    const decided = await api(steward.cookie, 'PATCH', `/api/steward/mentor-applications/${id}`, { decision: 'approved', note: 'Welcome.' });
    expect(decided.status).toBe(200);
    expect(await events).toEqual(['account:changed', 'disconnect:io server disconnect']);

    const me = await api(applicant.cookie, 'GET', '/api/auth/me');
    expect(((await me.json()) as { role: string }).role).toBe('mentor');
    // The same session, now a mentor's: staff routes answer.
    expect((await api(applicant.cookie, 'GET', '/api/mentors')).status).toBe(200);
    await connect(applicant.cookie);
  });

  test('when a steward sets the role someone already has, then their socket hears nothing and stays', async () => {
    const grower = await person('grower');
    const steward = await person('steward');
    const socket = await connect(grower.cookie);
    const events = heard(socket, 1500);
    const res = await api(steward.cookie, 'PATCH', `/api/steward/users/${grower.user.id}`, { role: 'grower' });
    expect(res.status).toBeLessThan(300);
    expect(await events).toEqual([]);
    expect(socket.connected).toBe(true);
  });
});
