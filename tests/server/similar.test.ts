import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { SYMPTOM_IDS } from '../../server/shared/vocabulary';
import { indexResolvedCase, queryWords } from '../../server/src/modules/cases/search-index';
import { SYMPTOM_BIT_ORDER, nearSymptomSets, symptomMask, symptomsOfMask } from '../../server/src/modules/cases/similar.service';
import { similarAnswerSchema } from '../../server/shared/case-schemas';
import { publishFieldNote as publish, unpublishFieldNote } from '../../server/src/modules/library/field-notes';
import { makeTestApp, type TestApp } from '../setup/test-app';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';
import { createCase, createResolvedCase } from '../factories/cases';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});

/** The field notes this file publishes, taken down again at the end: the library's search test
 * ranks notes by how rare their words are across the whole shared database. */
const publishedHere: number[] = [];
async function publishFieldNote(caseId: number) {
  publishedHere.push(caseId);
  return publish(caseId);
}

afterAll(async () => {
  for (const id of publishedHere) await unpublishFieldNote(id);
  await t.close();
});

/** A made-up word of letters only, so each test's cases are told apart from the rest of the database. */
const nonce = () =>
  Array.from(crypto.randomBytes(8))
    .map((b) => String.fromCharCode(97 + (b % 26)))
    .join('');

const ids = (body: { items: { id: number }[] }) => body.items.map((i) => i.id);

describe('batches like this', () => {
  test('when a draft names a stage and symptoms, then resolved cases with the same stage and shared symptoms rank above the others', async () => {
    const grower = await signedIn(t.app, 'mentor');
    const word = nonce();
    const text = { description: `The ${word} jar on the shelf changed this week.` };
    const sameBoth = await createResolvedCase(grower.user.id, { ...text, stage: 'IMO2', symptoms: ['bubbling', 'smell-alcoholic'] });
    const sameStageOnly = await createResolvedCase(grower.user.id, { ...text, stage: 'IMO2', symptoms: ['dry-crusty'] });
    const sameSymptomsOnly = await createResolvedCase(grower.user.id, { ...text, stage: 'LAB', symptoms: ['bubbling', 'smell-alcoholic'] });
    const neither = await createResolvedCase(grower.user.id, { ...text, stage: 'WCA', symptoms: ['colour-brown'] });
    const res = await grower.browser
      .post('/api/cases/similar')
      .set(JSON_HEADERS)
      .send({ stage: 'IMO2', symptoms: ['bubbling', 'smell-alcoholic'], description: `my ${word} jar`, limit: 20 });
    expect(res.status).toBe(200);
    const order = ids(res.body);
    expect(order[0]).toBe(sameBoth);
    expect(order.indexOf(sameBoth)).toBeLessThan(order.indexOf(sameStageOnly));
    expect(order.indexOf(sameBoth)).toBeLessThan(order.indexOf(sameSymptomsOnly));
    expect(order).toContain(neither); // the shared word alone still counts
    expect(order.indexOf(sameStageOnly)).toBeLessThan(order.indexOf(neither));
    expect(order.indexOf(sameSymptomsOnly)).toBeLessThan(order.indexOf(neither));
    const top = res.body.items[0];
    expect(top).toMatchObject({ stage: 'IMO2', cause: 'too-little-sugar', remedy: 'add-sugar', outcome: 'recovered', status: 'recovered' });
    expect(top.reasons).toEqual(
      expect.arrayContaining(['Same stage (IMO2)', 'Shares 2 symptoms: bubbling or foaming, alcoholic or yeasty', expect.stringMatching(new RegExp(`^Mentions .*${word}`))]),
    );
    expect(top.score).toBeGreaterThan(res.body.items[1].score);
  });

  test('when the description is misspelt, then the right case is still found and the correction is reported', async () => {
    const { browser, user } = await signedIn(t.app, 'mentor');
    const word = nonce();
    const target = await createResolvedCase(user.id, {
      stage: 'OHN',
      symptoms: ['smell-sour'],
      title: `Cinnamon ${word} tincture went cloudy`,
      description: 'The cinnamon and liquorice tincture turned cloudy and sour after the second straining.',
    });
    const misspelt = `${word.slice(0, 3)}${word.slice(4)}`; // one letter dropped
    const res = await browser
      .post('/api/cases/similar')
      .set(JSON_HEADERS)
      .send({ stage: 'other', description: `my cinamon ${misspelt} tincure is clowdy`, limit: 10 });
    expect(res.status).toBe(200);
    expect(ids(res.body)).toContain(target);
    expect(ids(res.body)[0]).toBe(target);
    expect(res.body.terms).toEqual(expect.arrayContaining([{ word: 'cinamon', term: 'cinnamon' }, { word: misspelt, term: word }]));
    const item = res.body.items.find((i: { id: number }) => i.id === target);
    expect(item.reasons.join(' ')).toMatch(/Mentions .*cinnamon/);
  });

  test('when two letters of a short word are swapped ("cluody", only 0.27 like "cloudy" by trigrams), then it is read as the known word', async () => {
    const { browser, user } = await signedIn(t.app, 'mentor');
    const word = nonce();
    const target = await createResolvedCase(user.id, { stage: 'FPJ', symptoms: ['smell-sour'], title: `Nettle ${word} brew went cloudy`, description: 'Cloudy and sour by the third day.' });
    const res = await browser.post('/api/cases/similar').set(JSON_HEADERS).send({ stage: 'other', description: `${word} brew gone cluody`, limit: 10 });
    expect(res.status).toBe(200);
    expect(ids(res.body)[0]).toBe(target);
    expect(res.body.terms).toEqual(expect.arrayContaining([{ word: 'cluody', term: 'cloudy' }]));
  });

  test('when the draft and a resolved case share everyday fillers ("lots of", "quite a bit"), then only the telling words are given as the reason', async () => {
    const { browser, user } = await signedIn(t.app, 'mentor');
    const word = nonce();
    // Four telling words in all (the reason names at most four): the nonce, crock, froth and odd.
    const fillers = 'Lots of froth, quite a bit, still something rather odd.';
    const target = await createResolvedCase(user.id, { stage: 'FPJ', symptoms: ['free-liquid'], description: `The ${word} crock. ${fillers}` });
    const res = await browser
      .post('/api/cases/similar')
      .set(JSON_HEADERS)
      .send({ stage: 'FPJ', description: `My ${word} crock has ${fillers.toLowerCase()}`, limit: 10 });
    expect(res.status).toBe(200);
    const item = res.body.items.find((i: { id: number }) => i.id === target);
    const mentions = item.reasons.find((r: string) => r.startsWith('Mentions '));
    expect(mentions).toMatch(new RegExp(word));
    expect(mentions).toMatch(/crock/);
    expect(mentions).not.toMatch(/\b(lots|quite|bit|still|something|rather)\b/);
    expect(queryWords(fillers)).toEqual(['froth', 'odd']);
  });

  test('when the draft says when and how it was noticed ("since yesterday", "it started to look"), then those words are not given as the reason', async () => {
    const { browser, user } = await signedIn(t.app, 'mentor');
    const word = nonce();
    const target = await createResolvedCase(user.id, { stage: 'FPJ', symptoms: ['smell-sour'], description: `The ${word} crock smells sour since yesterday and started to look odd.` });
    const res = await browser
      .post('/api/cases/similar')
      .set(JSON_HEADERS)
      .send({ stage: 'FPJ', description: `Since yesterday my ${word} crock smells sour and it started to look worse today than two days ago.`, limit: 10 });
    expect(res.status).toBe(200);
    const item = res.body.items.find((i: { id: number }) => i.id === target);
    const mentions = item.reasons.find((r: string) => r.startsWith('Mentions '));
    expect(mentions).toMatch(new RegExp(word));
    expect(mentions).not.toMatch(/\b(since|yesterday|today|ago|started|look)\b/);
    expect(queryWords('Since yesterday, worse today than two days ago; tonight or tomorrow')).toEqual(['worse', 'two', 'days']);
    expect(queryWords('I noticed it started to froth; it looks and seems sour, as it seemed to look')).toEqual(['froth', 'sour']);
  });

  test('when a case asks for batches like it, then it never lists itself, nor open cases; the grower sees only published ones, as field notes', async () => {
    const grower = await signedIn(t.app);
    const mentor = await signedIn(t.app, 'mentor');
    const word = nonce();
    const description = `White ${word} threads on the bran pile.`;
    const own = await createCase(grower.user.id, { stage: 'IMO3', symptoms: ['colour-white'], description });
    const openOther = await createCase(mentor.user.id, { stage: 'IMO3', symptoms: ['colour-white'], description });
    const published = await createResolvedCase(mentor.user.id, { stage: 'IMO3', symptoms: ['colour-white'], description, published: true });
    const { slug } = await publishFieldNote(published);
    const unpublished = await createResolvedCase(mentor.user.id, { stage: 'IMO3', symptoms: ['colour-white'], description, published: false, outcome: 'lost' });

    const forGrower = await grower.browser.get(`/api/cases/${own}/similar?limit=20`);
    expect(forGrower.status).toBe(200);
    const answer = similarAnswerSchema.parse(forGrower.body);
    expect(answer.items.every((i) => i.kind === 'note')).toBe(true);
    expect(answer.items.map((i) => (i.kind === 'note' ? i.slug : null))).toContain(slug);
    // Neither the unpublished case nor the open ones, under any name.
    expect(JSON.stringify(forGrower.body)).not.toMatch(new RegExp(`"id":(${own}|${openOther}|${unpublished})\\b`));
    expect(forGrower.body.items.filter((i: { slug: string }) => i.slug.endsWith(`-${unpublished}`) || i.slug.endsWith(`-${openOther}`))).toEqual([]);

    const forMentor = await mentor.browser.get(`/api/cases/${own}/similar?limit=20`);
    expect(similarAnswerSchema.parse(forMentor.body).items.every((i) => i.kind === 'case')).toBe(true);
    expect(ids(forMentor.body)).toEqual(expect.arrayContaining([published, unpublished]));
    const lost = forMentor.body.items.find((i: { id: number }) => i.id === unpublished);
    expect(lost).toMatchObject({ status: 'lost', outcome: 'lost', published: false });

    const ofResolved = await mentor.browser.get(`/api/cases/${published}/similar?limit=20`);
    expect(ids(ofResolved.body)).not.toContain(published);
    expect(ids(ofResolved.body)).toContain(unpublished);
  });

  test("when grower B asks for batches like a draft that matches grower A's published case, then B gets only its anonymised field note: never A's title, name, words or case id", async () => {
    const word = nonce();
    const a = await signedIn(t.app, 'grower', `Ottoline ${word}`);
    const b = await signedIn(t.app);
    const mentor = await signedIn(t.app, 'mentor');
    const rawTitle = `Ottoline ${word}'s FFJ crock smelled of ${word} wine`;
    const caseOfA = await createResolvedCase(a.user.id, {
      stage: 'FFJ',
      symptoms: ['smell-alcoholic', 'colour-white'],
      title: rawTitle,
      description: `Ottoline ${word} here: my plum crock grew a white skin and smelled of wine by day four. Mail me at ottoline@example.test.`,
      summary: 'Too little sugar for ripe plums; sugar added to equal weights and the smell turned sweet again.',
      published: true,
    });
    const note = await publishFieldNote(caseOfA);
    // A published case whose note is not written (yet) is not shown to growers at all.
    const noteless = await createResolvedCase(mentor.user.id, { stage: 'FFJ', symptoms: ['smell-alcoholic', 'colour-white'], description: `${word} plums with a white skin`, published: true });

    const draft = { stage: 'FFJ', symptoms: ['smell-alcoholic', 'colour-white'], description: `My ${word} plum crock has a white skin and smells of wine`, limit: 20 };
    const res = await b.browser.post('/api/cases/similar').set(JSON_HEADERS).send(draft);
    expect(res.status).toBe(200);
    const answer = similarAnswerSchema.parse(res.body);
    const mine = answer.items.find((i) => i.kind === 'note' && i.slug === note.slug);
    expect(mine).toMatchObject({ kind: 'note', stage: 'FFJ', cause: 'too-little-sugar', remedy: 'add-sugar', outcome: 'recovered' });
    expect(mine && 'id' in mine).toBe(false);
    const [entry] = await getSequelize().query<{ title: string; summary: string }>(`SELECT title, summary FROM library_entries WHERE slug = :slug`, {
      replacements: { slug: note.slug },
      type: QueryTypes.SELECT,
    });
    expect(mine).toMatchObject({ title: entry.title, summary: entry.summary });
    const body = JSON.stringify(res.body);
    expect(body).not.toContain(rawTitle);
    expect(body).not.toContain('Ottoline');
    expect(body).not.toContain('ottoline@example.test');
    expect(body).not.toContain('/cases/');
    expect(answer.items.some((i) => i.kind === 'note' && i.slug.endsWith(`-${noteless}`))).toBe(false);
    for (const item of res.body.items) expect(Object.keys(item)).not.toContain('id');

    // The same case on B's own case page.
    const own = await createCase(b.user.id, { stage: 'FFJ', symptoms: ['smell-alcoholic', 'colour-white'], description: draft.description });
    const onPage = await b.browser.get(`/api/cases/${own}/similar?limit=20`);
    expect(onPage.body.items.map((i: { slug?: string }) => i.slug)).toContain(note.slug);
    expect(JSON.stringify(onPage.body)).not.toContain('Ottoline');

    // Mentors keep seeing the case itself.
    const forMentor = await mentor.browser.post('/api/cases/similar').set(JSON_HEADERS).send(draft);
    const theCase = forMentor.body.items.find((i: { id?: number }) => i.id === caseOfA);
    expect(theCase).toMatchObject({ kind: 'case', title: rawTitle, published: true });
    expect(ids(forMentor.body)).toContain(noteless);
  });

  test("when grower B types a word that only grower A's private case text holds (a place the note leaves out), then no note is lifted by it, named for it, or listed in terms", async () => {
    const place = nonce();
    const a = await signedIn(t.app, 'grower');
    const { user: mentor } = await signedIn(t.app, 'mentor');
    const b = await signedIn(t.app);
    const caseOfA = await createResolvedCase(a.user.id, {
      stage: 'WCA',
      symptoms: ['colour-light-grey'],
      mentorId: mentor.id,
      title: 'Calcium extract went grey',
      description: `The shells soaked by the ${place} pump house went grey.`,
      summary: 'Grey from unwashed shells; rinsed and roasted again, it cleared.',
      published: true,
    });
    await getSequelize().query(`UPDATE cases SET redact_terms = $2 WHERE id = $1`, { bind: [caseOfA, [place]] });
    const note = await publishFieldNote(caseOfA);
    const [entry] = await getSequelize().query<{ text: string }>(`SELECT title || ' ' || summary || ' ' || body AS text FROM library_entries WHERE slug = $1`, {
      bind: [note.slug],
      type: QueryTypes.SELECT,
    });
    expect(entry.text.toLowerCase()).not.toContain(place); // the note leaves the place out

    // Nothing but the private word in common: no stage, no symptoms.
    const probe = await b.browser.post('/api/cases/similar').set(JSON_HEADERS).send({ description: `${place} ${place}`, limit: 20 });
    expect(probe.status).toBe(200);
    expect(probe.body.items.map((i: { slug: string }) => i.slug)).not.toContain(note.slug);
    expect(JSON.stringify(probe.body)).not.toContain(place);

    // With the structure in common the note may be shown, but never for the private word.
    const near = await b.browser.post('/api/cases/similar').set(JSON_HEADERS).send({ stage: 'WCA', symptoms: ['colour-light-grey'], description: `${place} shells grey`, limit: 20 });
    const shown = near.body.items.find((i: { slug: string }) => i.slug === note.slug);
    expect(shown).toBeDefined();
    expect(JSON.stringify(near.body)).not.toContain(place);
    expect(shown.reasons.join(' ')).toMatch(/Mentions .*(shells|grey)/);
  });

  test('when a grower misspells a word, then the reasons name it as they typed it, and no reading of it from other cases is sent', async () => {
    const { user } = await signedIn(t.app, 'mentor');
    const grower = await signedIn(t.app);
    const word = nonce();
    const target = await createResolvedCase(user.id, { stage: 'OHN', symptoms: ['colour-white'], title: `Garlic ${word} extract went cloudy`, description: 'The garlic extract turned cloudy.', published: true });
    await publishFieldNote(target);
    const misspelt = `${word.slice(0, 3)}${word.slice(4)}`;
    const res = await grower.browser.post('/api/cases/similar').set(JSON_HEADERS).send({ stage: 'OHN', description: `garlic ${misspelt} cloudy`, limit: 20 });
    const item = res.body.items.find((i: { slug: string }) => i.slug.endsWith(`-${target}`));
    expect(item.reasons.join(' ')).toMatch(new RegExp(`Mentions .*${misspelt}`));
    expect(JSON.stringify(res.body.terms)).not.toContain(`"${word}"`);
  });

  test('when no limit is given, then at most five come back; over twenty is refused', async () => {
    const { browser, user } = await signedIn(t.app, 'mentor');
    const word = nonce();
    for (let i = 0; i < 7; i++) await createResolvedCase(user.id, { stage: 'FFJ', symptoms: ['colour-brown'], description: `${word} plums` });
    const res = await browser.post('/api/cases/similar').set(JSON_HEADERS).send({ stage: 'FFJ', symptoms: ['colour-brown'], description: `${word}` });
    expect(res.body.items).toHaveLength(5);
    expect((await browser.post('/api/cases/similar').set(JSON_HEADERS).send({ stage: 'FFJ', limit: 21 })).status).toBe(400);
    expect((await browser.get(`/api/cases/${res.body.items[0].id}/similar?limit=50`)).status).toBe(400);
  });

  test("when another grower asks for batches like someone's case, then 404", async () => {
    const owner = await signedIn(t.app);
    const stranger = await signedIn(t.app);
    const id = await createCase(owner.user.id);
    expect((await stranger.browser.get(`/api/cases/${id}/similar`)).status).toBe(404);
  });

  test('when a resolved case is indexed twice, then its words count once, cut the way queries cut them', async () => {
    const { user } = await signedIn(t.app, 'mentor');
    const word = nonce();
    const id = await createResolvedCase(user.id, { stage: 'LAB', symptoms: [], description: `Milk serum smelled of ${word}-ish cheese.` });
    await getSequelize().transaction((transaction) => indexResolvedCase(id, transaction));
    const rows = await getSequelize().query<{ term: string; uses: number }>(`SELECT term, uses FROM search_terms WHERE term = :word`, {
      replacements: { word },
      type: QueryTypes.SELECT,
    });
    expect(rows).toEqual([{ term: word, uses: 1 }]);
    expect(queryWords(`Milk serum smelled of ${word}-ish cheese.`)).toEqual(['milk', 'serum', 'smelled', word, 'ish', 'cheese']);
    // An open case is not indexed at all.
    const open = await createCase(user.id, { description: `${word}zz` });
    expect(await getSequelize().transaction((transaction) => indexResolvedCase(open, transaction))).toBe(false);
  });

  test('when a symptom is in the vocabulary, then it has a bit, and the database and the server agree on the mask', async () => {
    // A symptom added to the vocabulary without a migration appending it to the mask fails here.
    expect([...SYMPTOM_IDS].sort()).toEqual([...SYMPTOM_BIT_ORDER].sort());
    const rows = await getSequelize().query<{ s: string; mask: string }>(
      `SELECT s, case_symptom_mask(ARRAY[s]) AS mask FROM unnest(ARRAY[:ids]::text[]) AS s`,
      { replacements: { ids: [...SYMPTOM_IDS] }, type: QueryTypes.SELECT },
    );
    for (const row of rows) expect(Number(row.mask)).toBe(symptomMask([row.s]));
    const some = ['bubbling', 'smell-sour', 'colour-white'] as const;
    const [both] = await getSequelize().query<{ mask: string }>(`SELECT case_symptom_mask(ARRAY[:some]::text[]) AS mask`, {
      replacements: { some: [...some] },
      type: QueryTypes.SELECT,
    });
    expect(Number(both.mask)).toBe(symptomMask([...some]));
    expect(symptomsOfMask(symptomMask([...some])).sort()).toEqual([...some].sort());
  });

  test('when the nearest symptom sets are listed, then the set itself comes first and none falls below Jaccard 0.4', () => {
    const mask = symptomMask(['bubbling', 'smell-sour', 'colour-white']);
    const near = nearSymptomSets(mask);
    expect(near[0]).toBe(mask);
    expect(new Set(near).size).toBe(near.length);
    expect(near.length).toBeLessThanOrEqual(400);
    const jaccard = (a: number, b: number) => {
      const count = (x: number) => symptomsOfMask(x).length;
      return count(a & b) / count(a | b);
    };
    const scores = near.map((set) => jaccard(set, mask));
    expect(Math.min(...scores)).toBeGreaterThanOrEqual(0.4);
    expect(scores).toEqual([...scores].sort((a, b) => b - a));
    // one symptom dropped and one added, e.g. {bubbling, sour, slimy}: 2 / 4
    expect(near).toContain(symptomMask(['bubbling', 'smell-sour', 'slimy']));
    expect(nearSymptomSets(0)).toEqual([]);
  });
});
