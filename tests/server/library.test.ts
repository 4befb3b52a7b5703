import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { wilsonInterval } from '../../server/shared/track-record';
import { getSequelize } from '../../server/src/db/sequelize';
import { publishFieldNote } from '../../server/src/modules/library/field-notes';
import { KNOWLEDGE_DIR, loadKnowledge } from '../../server/src/modules/library/knowledge-loader';
import { LIBRARY_TUNING, invalidateRemedyRecords } from '../../server/src/modules/library/library.service';
import { unpublishFieldNote } from '../../server/src/modules/library/field-notes';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createResolvedCase, type CaseOptions } from '../factories/cases';
import { signedIn } from '../factories/sign-in';

let t: TestApp;
let growerId: number;
const guideFiles = fs.readdirSync(KNOWLEDGE_DIR).filter((f) => f.endsWith('.md'));

/** A resolved case with consent, published as a field note; returns the note's slug. */
async function note(options: CaseOptions): Promise<string> {
  const caseId = await createResolvedCase(growerId, { published: true, ...options });
  return (await publishFieldNote(caseId)).slug;
}

let bubblingSour: string;
let bubblingOnly: string;
let unrelated: string;

beforeAll(async () => {
  t = makeTestApp();
  await loadKnowledge();
  growerId = (await signedIn(t.app, 'grower')).user.id;
  bubblingSour = await note({
    stage: 'FPJ',
    symptoms: ['bubbling', 'smell-sour'],
    title: 'Nettle juice bubbling hard with a sour smell',
    description: 'Thick froth, bubbles all over, sour like vinegar.',
    summary: 'A bubbling, sour FPJ crock on a sunny porch settled once moved into shade.',
    remedy: 'move-cooler',
    cause: 'too-warm',
  });
  bubblingOnly = await note({
    stage: 'IMO2',
    symptoms: ['bubbling'],
    title: 'IMO2 jar bubbling after a week',
    description: 'Bubbles rising along the glass.',
    summary: 'Half the sugar it needed; topped up, the bubbling stopped.',
  });
  unrelated = await note({
    stage: 'IMO1',
    symptoms: ['dry-crusty'],
    title: 'Rice box gone dry and crusty',
    description: 'Hard grains, nothing growing.',
    summary: 'Moistened and moved to damp litter; white within three days.',
    remedy: 'add-water',
    cause: 'too-dry',
  });
});
afterAll(async () => {
  await t.close();
});

describe('loading the guides in knowledge/', () => {
  test('when the server starts, then every guide file is in the library as a guide with its front matter', async () => {
    const rows = await getSequelize().query<{ slug: string; stages: string[]; sources: string[]; body: string }>(
      `SELECT slug, stages, sources, body FROM library_entries WHERE kind = 'guide'`,
      { type: QueryTypes.SELECT },
    );
    expect(rows.length).toBe(guideFiles.length);
    const fpj = rows.find((r) => r.slug === 'fpj-fermented-plant-juice')!;
    expect(fpj.stages).toEqual(['FPJ']);
    expect(fpj.sources.some((s) => s.includes('CTAHR SA-7'))).toBe(true);
    // The page shows the title as its heading, so the body does not repeat it.
    expect(fpj.body.startsWith('# ')).toBe(false);
  });

  test('when it runs again, then nothing is written; when two processes run it at once, then each guide is there once', async () => {
    const again = await loadKnowledge();
    expect(again).toMatchObject({ inserted: [], updated: [], removed: [], unchanged: guideFiles.length });
    await Promise.all([loadKnowledge(), loadKnowledge()]);
    const [row] = await getSequelize().query<{ n: number }>(`SELECT count(*)::int AS n FROM library_entries WHERE kind = 'guide'`, { type: QueryTypes.SELECT });
    expect(row.n).toBe(guideFiles.length);
  });

  test('when a guide file changes, then its row is updated; when it is gone, then its row is removed', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sporewell-guides-'));
    try {
      const file = path.join(dir, 'test-guide.md');
      const guide = (title: string) => `---\nslug: test-guide-for-loader\ntitle: "${title}"\nsummary: "A guide made by a test."\nstages: [LAB]\nsymptoms: [smell-sour]\nsources:\n  - "common practice"\n---\n\n# ${title}\n\nSome words about whey.\n`;
      fs.writeFileSync(file, guide('First title'));
      expect((await loadKnowledge({ dir, prune: false })).inserted).toEqual(['test-guide-for-loader']);
      fs.writeFileSync(file, guide('Second title'));
      expect((await loadKnowledge({ dir, prune: false })).updated).toEqual(['test-guide-for-loader']);
      const entry = await agent(t.app).get('/api/library/test-guide-for-loader');
      expect(entry.body).toMatchObject({ kind: 'guide', title: 'Second title', stages: ['LAB'], sources: ['common practice'], note: null });
      // A broken file is skipped and nothing is pruned while it is there.
      fs.writeFileSync(path.join(dir, 'broken.md'), '---\nslug: Not A Slug\n---\nbody');
      expect((await loadKnowledge({ dir })).removed).toEqual([]);
      fs.rmSync(path.join(dir, 'broken.md'));
      fs.rmSync(file);
      fs.writeFileSync(path.join(dir, 'other.md'), guide('Other').replace('test-guide-for-loader', 'test-guide-other'));
      const pruned = await loadKnowledge({ dir });
      expect(pruned.removed).toEqual(expect.arrayContaining(['test-guide-for-loader', 'fpj-fermented-plant-juice']));
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
      // Put the real guides back for the other tests.
      await loadKnowledge();
    }
    expect((await agent(t.app).get('/api/library/test-guide-for-loader')).status).toBe(404);
    expect((await agent(t.app).get('/api/library/fpj-fermented-plant-juice')).status).toBe(200);
  });
});

describe('GET /api/library search', () => {
  test('when a visitor searches "bubbels soure", then bubbling and sour notes come first, the one with both ahead, and the misspellings are read as known words', async () => {
    const res = await agent(t.app).get('/api/library').query({ q: 'bubbels soure', kind: 'note', pageSize: 50 });
    expect(res.status).toBe(200);
    const items: Array<{ slug: string; symptoms: string[] }> = res.body.items;
    const slugs = items.map((i) => i.slug);
    // Other test files share this database, so other bubbling notes may be there too.
    for (const item of items.slice(0, 3)) expect(item.symptoms.some((s) => s === 'bubbling' || s === 'smell-sour')).toBe(true);
    expect(slugs.indexOf(bubblingSour)).toBeGreaterThanOrEqual(0);
    // Only notes that are both bubbling and sour may rank above it (other files publish such notes).
    for (const item of items.slice(0, slugs.indexOf(bubblingSour))) expect(item.symptoms).toEqual(expect.arrayContaining(['bubbling', 'smell-sour']));
    expect(slugs.indexOf(bubblingSour)).toBeLessThan(slugs.indexOf(bubblingOnly));
    expect(slugs).not.toContain(unrelated);
    expect(res.body.readAs.soure).toContain('sour');
    expect(res.body.readAs.bubbels).toEqual(expect.arrayContaining(['bubbles']));
  });

  test('when a visitor swaps two letters of a short word ("crsuty", only 0.27 like "crusty" by trigrams), then it is read as the known word and the crusty note is found', async () => {
    const [{ like }] = await getSequelize().query<{ like: number }>(`SELECT similarity('crsuty', 'crusty') AS like`, { type: QueryTypes.SELECT });
    expect(like).toBeLessThan(0.3);
    const res = await agent(t.app).get('/api/library').query({ q: 'crsuty', kind: 'note', pageSize: 50 });
    expect(res.status).toBe(200);
    expect(res.body.readAs.crsuty).toContain('crusty');
    expect(res.body.items.map((i: { slug: string }) => i.slug)).toContain(unrelated);
  });

  test('when guides and notes are searched together with a misspelt word, then guides about it are found too', async () => {
    const res = await agent(t.app).get('/api/library').query({ q: 'bubling' });
    expect(res.status).toBe(200);
    const kinds = new Set(res.body.items.map((i: { kind: string }) => i.kind));
    expect(kinds).toEqual(new Set(['guide', 'note']));
  });

  test('when filtered by stage, symptom and kind, then only matching entries come back', async () => {
    const byStage = await agent(t.app).get('/api/library').query({ stage: 'FPJ' });
    expect(byStage.status).toBe(200);
    expect(byStage.body.items.length).toBeGreaterThan(0);
    expect(byStage.body.items.every((i: { stages: string[] }) => i.stages.includes('FPJ'))).toBe(true);
    const bySymptoms = await agent(t.app).get('/api/library?symptom=bubbling&symptom=smell-sour&kind=note');
    expect(bySymptoms.body.items.map((i: { slug: string }) => i.slug)).toContain(bubblingSour);
    expect(bySymptoms.body.items.map((i: { slug: string }) => i.slug)).not.toContain(bubblingOnly);
    const guides = await agent(t.app).get('/api/library').query({ kind: 'guide', pageSize: 50 });
    expect(guides.body.total).toBe(guideFiles.length);
    expect(guides.body.items.every((i: { kind: string; remedyRecord: unknown }) => i.kind === 'guide' && i.remedyRecord === null)).toBe(true);
  });

  test('when browsing without words, then guides come first and the list pages', async () => {
    const first = await agent(t.app).get('/api/library').query({ pageSize: 5 });
    expect(first.body).toMatchObject({ page: 1, pageSize: 5 });
    expect(first.body.items).toHaveLength(5);
    expect(first.body.items[0].kind).toBe('guide');
    expect(first.body.total).toBeGreaterThan(guideFiles.length);
    const far = await agent(t.app).get('/api/library').query({ page: 400 });
    expect(far.status).toBe(200);
    expect(far.body.items).toEqual([]);
  });

  test('when the query is 10,000 characters, then 400, not 500', async () => {
    const res = await agent(t.app).get('/api/library').query({ q: 'sour '.repeat(2000) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.q).toMatch(/under 200 characters/);
  });

  test.each([
    ['a NUL, a right-to-left override and mushrooms', encodeURIComponent('ab\u0000\u202e🍄🍄')],
    ['zero-width joiners only', encodeURIComponent('\u200d\u200d\u200d')],
    ['Cyrillic look-alikes', encodeURIComponent('ѕоur')],
    ['a lone surrogate', '%ED%A0%80sour'],
    ['broken percent-encoding', '%E0%A4%A'],
  ])('when the query is odd Unicode (%s), then a clean answer, never 500', async (_what, encoded) => {
    const res = await agent(t.app).get(`/api/library?q=${encoded}`);
    expect([200, 400]).toContain(res.status);
    if (res.status === 200) expect(Array.isArray(res.body.items)).toBe(true);
  });

  test('when the query is full-width or accented letters, then they are read as plain letters', async () => {
    const res = await agent(t.app).get('/api/library').query({ q: 'ｎｅｔｔｌｅ búbbling', kind: 'note' });
    expect(res.status).toBe(200);
    // "nettle" is in this note's title only (the other test files' notes are about jars and rice).
    expect(res.body.items.map((i: { slug: string }) => i.slug).slice(0, 3)).toContain(bubblingSour);
  });

  test('when the query is not a plain string or a filter is unknown, then 400', async () => {
    expect((await agent(t.app).get('/api/library?q[a]=b')).status).toBe(400);
    expect((await agent(t.app).get('/api/library').query({ stage: 'IMO9' })).status).toBe(400);
    expect((await agent(t.app).get('/api/library').query({ kind: 'ticket' })).status).toBe(400);
    expect((await agent(t.app).get('/api/library').query({ page: -1 })).status).toBe(400);
  });
});

describe('common words: candidates from the postings (migration 0304)', () => {
  const postingsOf = (slug: string) =>
    getSequelize().query<{ term: string; impact: number }>(
      `SELECT p.term, p.impact FROM library_postings p JOIN library_entries e ON e.id = p.entry_id WHERE e.slug = $1 ORDER BY p.term`,
      { bind: [slug], type: QueryTypes.SELECT },
    );

  test('when a note is published, then each word of its title, summary and labels has a posting, a word in the short title weighing more than one only in the long summary', async () => {
    const rows = await postingsOf(bubblingSour);
    const impact = new Map(rows.map((r) => [r.term, r.impact]));
    expect(impact.get('nettle')).toBeGreaterThan(0); // title only
    expect(impact.get('porch')).toBeGreaterThan(0); // summary only
    expect(impact.get('nettle')!).toBeGreaterThan(impact.get('porch')!);
    // "bubbling" is in the title, the summary and the labels: the three add up.
    expect(impact.get('bubbling')!).toBeGreaterThan(impact.get('nettle')!);
    expect(rows.every((r) => r.impact > 0)).toBe(true);
  });

  test('when every word counts as common (row budget 0), then the postings alone still put the bubbling, sour note first', async () => {
    const budget = LIBRARY_TUNING.rowBudget;
    LIBRARY_TUNING.rowBudget = 0;
    try {
      const res = await agent(t.app).get('/api/library').query({ q: 'bubbels soure nettle', kind: 'note' });
      expect(res.status).toBe(200);
      expect(res.body.items[0].slug).toBe(bubblingSour);
      const filtered = await agent(t.app).get('/api/library').query({ q: 'bubbling', stage: 'IMO2', kind: 'note', pageSize: 50 });
      expect(filtered.body.items.map((i: { slug: string }) => i.slug)).toContain(bubblingOnly);
      expect(filtered.body.items.every((i: { stages: string[] }) => i.stages.includes('IMO2'))).toBe(true);
    } finally {
      LIBRARY_TUNING.rowBudget = budget;
    }
  });

  test('when a note is withdrawn, then its postings go with it', async () => {
    const caseId = await createResolvedCase(growerId, { published: true, stage: 'LAB', title: 'Whey layer gone pink', summary: 'Pink whey poured off.' });
    const { slug } = await publishFieldNote(caseId);
    expect((await postingsOf(slug)).map((r) => r.term)).toContain('pink');
    await unpublishFieldNote(caseId);
    const [{ n }] = await getSequelize().query<{ n: number }>(
      `SELECT count(*)::int AS n FROM library_postings p WHERE NOT EXISTS (SELECT 1 FROM library_entries e WHERE e.id = p.entry_id)`,
      { type: QueryTypes.SELECT },
    );
    expect(n).toBe(0);
    expect(await postingsOf(slug)).toEqual([]);
  });
});

describe('remedy track records in the library', () => {
  test('when one remedy saved 30 of 32 and another 2 of 2, then the steady one ranks first by its lower bound, not the raw rate', async () => {
    // Outcomes only (no notes needed): what the records are made of.
    await getSequelize().query(
      `INSERT INTO cases (grower_id, stage, title, status, remedy, outcome, stars)
       SELECT $1::int, 'IMO3', 'record case', CASE WHEN n <= 30 THEN 'recovered' ELSE 'lost' END, 'change-cover',
              CASE WHEN n <= 30 THEN 'recovered' ELSE 'lost' END, 4
         FROM generate_series(1, 32) n
       UNION ALL
       SELECT $1::int, 'IMO3', 'record case', 'recovered', 'protect-from-pests', 'recovered', 5 FROM generate_series(1, 2)`,
      { bind: [growerId] },
    );
    invalidateRemedyRecords();
    const res = await agent(t.app).get('/api/library').query({ kind: 'note' });
    const records: Array<{ remedy: string; saved: number; trials: number; lower: number; rate: number; text: string }> = res.body.remedyRecords;
    for (const r of records) expect(r.lower).toBeCloseTo(wilsonInterval(r.saved, r.trials).lower, 12);
    for (let i = 1; i < records.length; i += 1) expect(records[i - 1].lower).toBeGreaterThanOrEqual(records[i].lower);
    const steady = records.findIndex((r) => r.remedy === 'change-cover');
    const lucky = records.findIndex((r) => r.remedy === 'protect-from-pests');
    expect(records[lucky].rate).toBeGreaterThanOrEqual(records[steady].rate);
    expect(steady).toBeLessThan(lucky);
    expect(records[steady].text).toMatch(/^saved \d+ of \d+ batches .*\(lower bound \d+ %\)$/);
  });

  test('when a note is shown, then it carries its remedy’s record with partly saved batches counted as saved and named', async () => {
    await createResolvedCase(growerId, { remedy: 'move-cooler', outcome: 'partly', published: false });
    invalidateRemedyRecords();
    const res = await agent(t.app).get(`/api/library/${bubblingSour}`);
    const record = res.body.remedyRecord;
    expect(record.remedy).toBe('move-cooler');
    expect(record.partly).toBeGreaterThanOrEqual(1);
    expect(record.saved).toBe(record.recovered + record.partly);
    expect(record.text).toContain(`${record.partly} of them partly`);
  });
});

describe('GET /api/library/:slug', () => {
  test('when the slug is unknown or malformed, then 404', async () => {
    expect((await agent(t.app).get('/api/library/no-such-page')).status).toBe(404);
    expect((await agent(t.app).get('/api/library/..%2F..%2Fetc')).status).toBe(404);
    expect((await agent(t.app).get(`/api/library/${'a'.repeat(300)}`)).status).toBe(404);
  });
});
