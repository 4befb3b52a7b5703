// The rounds pages' sharing rules (server/src/modules/cases/rounds-page.ts) with a clock and a
// builder under the test's control: which request may have which page, and when the next page
// is begun.
import type { Request } from 'express';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { createRoundsPages, PAGE_TTL_MS, type PreparedJson } from '../../server/src/modules/cases/rounds-page';
import type { CaseListFilter } from '../../server/src/modules/cases/cases.service';

const filter = { statuses: null, query: { sort: 'urgency', page: 1, pageSize: 50 }, visibility: { asides: true, hidden: false } } as unknown as CaseListFilter;

/** A request whose session read saw this change count. */
const asking = (count: number) => ({ count }) as unknown as Request;
const watch = { seenBy: (req: Request) => (req as unknown as { count?: number }).count };

let builds: { resolve(value: unknown): void }[];
const build = () => new Promise<unknown>((resolve) => builds.push({ resolve }));
const bodyOf = (page: PreparedJson | Promise<PreparedJson>) => {
  if (page instanceof Promise) throw new Error('expected a built page, got one on its way');
  return JSON.parse(page.body.toString('utf8')) as unknown;
};
const settle = () => new Promise((resolve) => setImmediate(resolve));

beforeEach(() => {
  builds = [];
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(0);
});
afterEach(() => {
  vi.useRealTimers();
});

describe('sharing a rounds page', () => {
  test('when requests read no newer count than the page, then they share it; a newer count builds another', async () => {
    const pages = createRoundsPages(watch, build);
    const first = pages.page(asking(5), filter);
    expect(first).toBeInstanceOf(Promise);
    expect(pages.page(asking(5), filter)).toBe(first);
    builds[0].resolve({ v: 'count 5' });
    await first;
    expect(bodyOf(pages.page(asking(3), filter))).toEqual({ v: 'count 5' });
    // A request that read a newer count may know of a change the page does not hold.
    const newer = pages.page(asking(6), filter);
    expect(builds).toHaveLength(2);
    builds[1].resolve({ v: 'count 6' });
    expect(JSON.parse((await newer).body.toString('utf8'))).toEqual({ v: 'count 6' });
    expect(bodyOf(pages.page(asking(5), filter))).toEqual({ v: 'count 6' });
  });

  test('when a page has been given out for three quarters of its time, then the next is begun and given out once built, and none is older than the limit', async () => {
    const pages = createRoundsPages(watch, build);
    const first = pages.page(asking(1), filter);
    builds[0].resolve({ v: 'first' });
    await first;
    vi.setSystemTime(700);
    expect(bodyOf(pages.page(asking(1), filter))).toEqual({ v: 'first' });
    expect(builds).toHaveLength(1);
    vi.setSystemTime(800);
    // Still the first, at once; the next one is on its way.
    expect(bodyOf(pages.page(asking(1), filter))).toEqual({ v: 'first' });
    expect(builds).toHaveLength(2);
    vi.setSystemTime(900);
    expect(bodyOf(pages.page(asking(1), filter))).toEqual({ v: 'first' });
    expect(builds).toHaveLength(2);
    // Past the limit and the next not built yet: wait for it rather than take the old one.
    vi.setSystemTime(PAGE_TTL_MS + 50);
    const waiting = pages.page(asking(1), filter);
    expect(waiting).toBeInstanceOf(Promise);
    builds[1].resolve({ v: 'second' });
    expect(JSON.parse((await waiting).body.toString('utf8'))).toEqual({ v: 'second' });
    await settle();
    expect(bodyOf(pages.page(asking(1), filter))).toEqual({ v: 'second' });
    expect(builds).toHaveLength(2);
  });

  test('when a request was not read with a count, then it gets a page of its own', async () => {
    const pages = createRoundsPages(watch, build);
    const own = pages.page({} as Request, filter);
    const other = pages.page({} as Request, filter);
    expect(own).not.toBe(other);
    expect(builds).toHaveLength(2);
  });

  test('when a build fails, then the next request builds again', async () => {
    let tries = 0;
    const pages = createRoundsPages(watch, () => (tries += 1) === 1 ? Promise.reject(new Error('database away')) : Promise.resolve({ v: 'back' }));
    await expect(pages.page(asking(1), filter)).rejects.toThrow('database away');
    await settle();
    expect(JSON.parse((await pages.page(asking(1), filter)).body.toString('utf8'))).toEqual({ v: 'back' });
    expect(tries).toBe(2);
  });
});
