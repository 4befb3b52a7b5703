// A signed-in browser for a fresh user of the given role.
import type { Express } from 'express';
import type { Role } from '../../server/shared/case-status';
import { agent, TEST_ORIGIN } from '../setup/test-app';
import { createUser } from './users';

export const JSON_HEADERS = { 'Content-Type': 'application/json', Origin: TEST_ORIGIN };

export async function signedIn(app: Express, role: Role = 'grower', displayName?: string) {
  const user = await createUser({ role, displayName });
  const browser = agent(app);
  const res = await browser.post('/api/auth/login').set(JSON_HEADERS).send({ email: user.email, password: user.password });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { user, browser };
}
