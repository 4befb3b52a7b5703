// The pure parts of the live thread and the rounds on the client: merging messages from every
// road into one ordered list, turning web addresses into links, and the rounds filters in the
// address bar.
import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import type { ThreadMessage } from '../../server/shared/socket-events';
import { lastSeqOf, markHidden, mergeMessages } from '../../client/src/features/threads/lib/merge-messages';
import { splitLinks } from '../../client/src/features/threads/lib/split-links';
import { newClientId } from '../../client/src/features/threads/lib/client-id';
import { clientIdSchema } from '../../server/shared/socket-events';
import {
  DEFAULT_FILTERS,
  apiQueryFromFilters,
  filtersFromSearch,
  searchFromFilters,
  type RoundsFilters,
} from '../../client/src/features/rounds/lib/rounds-filters';

function message(seq: number, extra: Partial<ThreadMessage> = {}): ThreadMessage {
  return {
    id: 1000 + seq,
    caseId: 7,
    seq,
    clientId: `client-${seq}-abc`,
    kind: 'text',
    body: `message ${seq}`,
    hidden: false,
    author: { id: 1, displayName: 'Rowan Tillsworth', role: 'grower' },
    photos: [],
    createdAt: new Date(Date.UTC(2026, 4, 1, 8, seq)).toISOString(),
    ...extra,
  };
}

describe('merging thread messages', () => {
  test('when the same messages arrive by several roads in any order, then each shows once, in seq order', () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.integer({ min: 1, max: 40 }), { maxLength: 25 }), { maxLength: 6 }), (batches) => {
        let thread: ThreadMessage[] = [];
        for (const batch of batches) thread = mergeMessages(thread, batch.map((seq) => message(seq)));
        const expected = [...new Set(batches.flat())].sort((a, b) => a - b);
        expect(thread.map((m) => m.seq)).toEqual(expected);
      }),
    );
  });

  test('when a copy of a message comes again hidden, then the hidden copy replaces the shown one', () => {
    const thread = mergeMessages([message(1), message(2)], [message(2, { hidden: true, body: 'Hidden by a steward' })]);
    expect(thread).toHaveLength(2);
    expect(thread[1].hidden).toBe(true);
  });

  test('when two stored messages carry one client id, then only the first stored (lower seq) is kept', () => {
    const thread = mergeMessages([message(3, { clientId: 'same-id-123' })], [message(5, { clientId: 'same-id-123' })]);
    expect(thread.map((m) => m.seq)).toEqual([3]);
  });

  test('when a steward hides a message, then its words and photos are dropped and it keeps its place', () => {
    const photo = { id: 9, url: '/p', thumbUrl: '/t', width: 1, height: 1 };
    const thread = markHidden([message(1), message(2, { photos: [photo] }), message(3)], 1002);
    expect(thread.map((m) => m.seq)).toEqual([1, 2, 3]);
    expect(thread[1]).toMatchObject({ hidden: true, body: '', photos: [] });
  });

  test('when asking for the last seq, then an empty or missing thread answers 0', () => {
    expect(lastSeqOf(undefined)).toBe(0);
    expect(lastSeqOf([])).toBe(0);
    expect(lastSeqOf([message(4), message(2)])).toBe(4);
  });
});

describe('client ids for messages', () => {
  test('when many ids are made, then each fits the server schema and none repeats', () => {
    const ids = Array.from({ length: 500 }, () => newClientId());
    for (const id of ids) expect(clientIdSchema.safeParse(id).success).toBe(true);
    expect(new Set(ids).size).toBe(ids.length);
  });
});

describe('links in message bodies', () => {
  test('when a body holds a web address, then only the address becomes a link and the sentence stop stays text', () => {
    expect(splitLinks('See https://example.test/jar?x=1. Then tell me.')).toEqual([
      { kind: 'text', text: 'See ' },
      { kind: 'link', text: 'https://example.test/jar?x=1', href: 'https://example.test/jar?x=1' },
      { kind: 'text', text: '. Then tell me.' },
    ]);
  });

  test('when an address is in brackets, then the closing bracket stays outside unless the address opened one', () => {
    expect(splitLinks('(see http://example.test/a)')[1]).toMatchObject({ kind: 'link', text: 'http://example.test/a' });
    expect(splitLinks('http://example.test/wiki/Rice_(grain).')[0]).toMatchObject({ text: 'http://example.test/wiki/Rice_(grain)' });
  });

  test('when a body holds markup or other schemes, then nothing but http and https becomes a link', () => {
    const body = '<script>alert(1)</script> javascript:alert(1) data:text/html,hi file:///etc/passwd';
    const parts = splitLinks(body);
    expect(parts.every((p) => p.kind === 'text')).toBe(true);
    expect(parts.map((p) => p.text).join('')).toBe(body);
  });

  test('when any text is split, then putting the parts back together gives the text unchanged', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.string(), fc.constantFrom('https://example.test/a', 'http://x.test/(b)', ' ', '.', ')', '\n'))), (pieces) => {
        const body = pieces.join('');
        expect(splitLinks(body).map((p) => p.text).join('')).toBe(body);
      }),
    );
  });
});

describe('rounds filters in the address bar', () => {
  test('when filters go into the address and back, then they come out the same', () => {
    const filters: RoundsFilters = { status: 'over_to_grower', stage: 'FPJ', symptom: 'bubbling', age: '1-3d', mine: true, sort: 'oldest', page: 3 };
    expect(filtersFromSearch(searchFromFilters(filters))).toEqual(filters);
    expect(searchFromFilters(DEFAULT_FILTERS).toString()).toBe('');
  });

  test('when the address holds unknown values, then the defaults stand in', () => {
    expect(filtersFromSearch(new URLSearchParams('status=solved&stage=XYZ&page=-2&sort=loudest&mine=yes'))).toEqual(DEFAULT_FILTERS);
  });

  test('when the open cases are asked for, then no status goes to the server (its default is the open ones)', () => {
    const query = apiQueryFromFilters({ ...DEFAULT_FILTERS, age: '6-24h' });
    expect(query.has('status')).toBe(false);
    expect(query.get('minAgeHours')).toBe('6');
    expect(query.get('maxAgeHours')).toBe('24');
    expect(query.get('sort')).toBe('urgency');
    expect(apiQueryFromFilters({ ...DEFAULT_FILTERS, status: 'all' }).get('status')).toBe('all');
  });
});
