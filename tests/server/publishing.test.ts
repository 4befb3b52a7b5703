import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { publishPendingNotes } from '../../server/src/modules/library/field-notes';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createResolvedCase } from '../factories/cases';
import { closeAs, reportAs, talkedCase } from '../factories/closing';
import { signedIn } from '../factories/sign-in';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

async function notesOf(caseId: number) {
  return getSequelize().query<{ slug: string }>(`SELECT slug FROM library_entries WHERE case_id = $1`, { bind: [caseId], type: QueryTypes.SELECT });
}

describe('a published field note leaves the people out', () => {
  test('when the case text names the grower, the mentor, an e-mail, a phone number and a flagged place, then none of it is in the note’s JSON', async () => {
    const { caseId, grower, mentor } = await talkedCase(t.app, {
      growerName: 'Rowena Quillfeather',
      mentorName: 'Marek Underhill',
      stage: 'FPJ',
      symptoms: ['bubbling', 'smell-sour'],
      title: 'Rowena’s crock frothing at Hollybrook Barn',
      description: '',
    });
    // The grower's real account address, as a grower might paste it into a description.
    await getSequelize().query(`UPDATE cases SET description = $2, location = 'the lean-to behind Tarnside cottage' WHERE id = $1`, {
      bind: [
        caseId,
        `I'm Rowena Quillfeather (${grower.user.email}, or call 07700 900123). My crock of nettle tips in the lean-to behind Tarnside cottage at Hollybrook Barn froths and smells sour. rowena says hi to Marek.`,
      ],
    });
    await closeAs(mentor.browser, caseId, {
      causeNotes: 'Marek Underhill thinks the sun on Hollybrook Barn warmed it.',
      remedy: 'move-cooler',
      remedyNotes: 'Rowena moved it to the cellar on Marek’s advice.',
      summary: 'Quillfeather’s FPJ frothed in the sun; moved somewhere cooler, it settled.',
      redactTerms: ['Hollybrook Barn'],
    }).expect(200);
    await reportAs(grower.browser, caseId, { consentToPublish: true, comment: 'Thanks Marek! It calmed down. — Rowena (write to rowena.q@example.test)' }).expect(201);

    const [{ slug }] = await notesOf(caseId);
    const visitor = agent(t.app);
    const entry = await visitor.get(`/api/library/${slug}`);
    expect(entry.status).toBe(200);
    const list = await visitor.get('/api/library').query({ q: 'crock frothing nettle', kind: 'note' });
    expect(list.status).toBe(200);
    expect(list.body.items.map((i: { slug: string }) => i.slug)).toContain(slug);

    for (const raw of [entry.text, list.text, slug]) {
      for (const secret of [grower.user.email, mentor.user.email, 'rowena.q@example.test', 'Rowena', 'Quillfeather', 'Marek', 'Underhill', 'Hollybrook', 'Tarnside', '900123']) {
        expect(raw.toLowerCase()).not.toContain(secret.toLowerCase());
      }
    }
    expect(entry.body.title).toBe('The grower’s crock frothing at [left out]');
    expect(entry.body.body).toContain('the mentor');
    expect(entry.body.body).toContain('\\[e-mail left out\\]');
    expect(entry.body.summary).toMatch(/^The grower’s FPJ frothed/);
    // Nothing that leads back to the case or the people on it.
    expect(Object.keys(entry.body)).not.toEqual(expect.arrayContaining(['caseId']));
    expect(entry.text).not.toMatch(/"(caseId|growerId|mentorId)"/);
  });

  test('when the mentor adds a word to leave out later, then re-publishing takes it out of the note', async () => {
    const { caseId, grower, mentor } = await talkedCase(t.app, { title: 'LAB by the Wickerby stile went pink', stage: 'LAB', symptoms: ['colour-pink-red'] });
    await closeAs(mentor.browser, caseId, { remedy: 'discard-restart', summary: 'Pink LAB near Wickerby stile: discarded and restarted.' }).expect(200);
    await reportAs(grower.browser, caseId, { outcome: 'lost', consentToPublish: true }).expect(201);
    const before = (await agent(t.app).get(`/api/library/${(await notesOf(caseId))[0].slug}`)).text;
    expect(before).toContain('Wickerby');
    const res = await mentor.browser.post(`/api/cases/${caseId}/publish`).set({ 'Content-Type': 'application/json', Origin: 'http://127.0.0.1:3999' }).send({ redactTerms: ['Wickerby stile'] });
    expect(res.status).toBe(200);
    const [{ slug }] = await notesOf(caseId);
    const after = await agent(t.app).get(`/api/library/${slug}`);
    expect(after.text).not.toContain('Wickerby');
    expect(slug).not.toContain('wickerby');
  });
});

describe('publishPendingNotes (start-up)', () => {
  test('when a resolved case is marked published with consent and has no note, then one is made, and running again makes none', async () => {
    const grower = await signedIn(t.app, 'grower');
    const caseId = await createResolvedCase(grower.user.id, { published: true, title: 'Seeded IMO2 that settled', stage: 'IMO2' });
    const unconsented = await createResolvedCase(grower.user.id, { published: false, title: 'Seeded IMO2 kept private' });
    expect(await publishPendingNotes()).toBeGreaterThanOrEqual(1);
    expect(await notesOf(caseId)).toHaveLength(1);
    expect(await notesOf(unconsented)).toHaveLength(0);
    await Promise.all([publishPendingNotes(), publishPendingNotes()]);
    expect(await notesOf(caseId)).toHaveLength(1);
    expect(await publishPendingNotes()).toBe(0);
  });
});
