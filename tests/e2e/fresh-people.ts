// People of their own for a browser test: the e2e database is shared with the other browser
// tests, so a test that changes anything (a claim, a closing, a track record) uses newcomers.
import { expect } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { newContext } from './browser';

export interface FreshPerson {
  id: number;
  email: string;
  password: string;
  displayName: string;
}

let made = 0;

/** A unique stamp for names, titles and e-mail addresses made in this run. */
export function stamp(): string {
  made += 1;
  return `${Date.now().toString(36)}${made}${Math.floor(Math.random() * 1296).toString(36)}`;
}

/** Signs a context in through the API (the way the sign-in form does, without the form). */
export async function signInByApi(context: BrowserContext, email: string, password = 'sporewell-demo'): Promise<void> {
  const res = await context.request.post('/api/auth/login', { data: { email, password } });
  expect(res.status(), `sign-in of ${email}`).toBe(200);
}

/**
 * A newcomer who joined through the API in a context of their own (closed again, so the browser
 * under test still has to sign in); a mentor is a grower whose role the demo steward changed.
 */
export async function freshPerson(browser: Browser, role: 'grower' | 'mentor', firstName: string): Promise<FreshPerson> {
  const id = stamp();
  const person = { email: `${firstName.toLowerCase()}-${id}@example.test`, password: `bran-and-mulch-${id}`, displayName: `${firstName} Larchfield ${id}` };
  const context = await newContext(browser);
  try {
    const joined = await context.request.post('/api/auth/register', { data: person });
    expect(joined.status(), `joining as ${person.email}`).toBe(201);
    const { id: userId } = (await joined.json()) as { id: number };
    if (role === 'mentor') {
      await context.request.post('/api/auth/logout');
      await signInByApi(context, 'steward@example.test');
      const changed = await context.request.patch(`/api/steward/users/${userId}`, { data: { role: 'mentor' } });
      expect(changed.status(), 'the steward making a mentor').toBe(200);
    }
    return { id: userId, ...person };
  } finally {
    await context.close();
  }
}
