// Keyboard alone (issue: proof, WCAG 2.1.1 Keyboard, 2.4.1 Bypass Blocks, 2.4.3 Focus Order,
// 2.4.7 Focus Visible): the main flows driven with page.keyboard only — Tab, Shift+Tab, Enter,
// Space, arrows and typing. Nothing is clicked and no field is filled that Tab did not reach;
// page.goto only opens the screen a flow starts on, as a typed address would. Every control Tab
// lands on must show a focus ring (outline) on itself or on what stands for it on screen.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import sharp from 'sharp';
import type { Browser, BrowserContext, FileChooser, Page } from 'playwright-core';
import { DESKTOP, launch, newContext, PHONE, shot } from './browser';
import { freshPerson, stamp, type FreshPerson } from './fresh-people';

/** Generous: a loaded machine can take seconds to hash a password or build a page. */
const WAIT = { timeout: 20_000 };

interface Focused {
  tag: string;
  type: string;
  role: string;
  name: string;
  checked: boolean | null;
  /** a visible outline is drawn on the control or on what stands for it (its label, its chip) */
  ring: boolean;
  /** the control or its stand-in has a visible box on screen */
  shown: boolean;
}

/** What has focus now, read from the page (reading only: nothing is changed). */
function focused(page: Page): Promise<Focused | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body || el === document.documentElement) return null;
    const clean = (s: string | null | undefined) => (s ?? '').replace(/\s+/g, ' ').trim();
    const field = el instanceof HTMLInputElement || el instanceof HTMLTextAreaElement || el instanceof HTMLSelectElement;
    const labelledBy = el.getAttribute('aria-labelledby');
    let name = el.getAttribute('aria-label') ?? '';
    if (!name && labelledBy) name = labelledBy.split(/\s+/).map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
    if (!name && field && el.labels?.length) name = [...el.labels].map((l) => l.textContent).join(' ');
    // Text and image descriptions, the way a button holding a thumbnail is named.
    if (!name && !field) name = `${el.textContent ?? ''} ${[...el.querySelectorAll('img')].map((img) => img.alt).join(' ')}`;
    if (!name) name = el.getAttribute('title') ?? '';
    const shows = (e: Element) => {
      const box = e.getBoundingClientRect();
      const style = getComputedStyle(e);
      return box.width > 2 && box.height > 2 && style.opacity !== '0' && style.visibility !== 'hidden';
    };
    const outlined = (e: Element) => {
      const style = getComputedStyle(e);
      return style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) >= 2 && style.outlineColor !== 'rgba(0, 0, 0, 0)';
    };
    // A control hidden for a drawn one (a chip, a star, a button-like label) shows focus there.
    const standIns = [el, el.closest('label'), ...(field && el.labels ? [...el.labels] : []), el.nextElementSibling].filter((e): e is Element => e !== null);
    const visible = standIns.filter(shows);
    // Tab also stops on a date field's own calendar button, inside the browser's shadow tree: the
    // field is still the active element but no longer :focus, and Chromium rings the button
    // itself (seen in a screenshot), out of reach of getComputedStyle.
    const onPickerButton = el instanceof HTMLInputElement && /^(date|time|datetime-local|month|week)$/.test(el.type) && !el.matches(':focus');
    return {
      tag: el.tagName.toLowerCase(),
      type: el.getAttribute('type') ?? '',
      role: el.getAttribute('role') ?? '',
      name: clean(name),
      checked: el instanceof HTMLInputElement && (el.type === 'checkbox' || el.type === 'radio') ? el.checked : null,
      ring: onPickerButton || (el.matches(':focus-visible') && visible.some(outlined)),
      shown: visible.length > 0,
    };
  });
}

const describeStop = (f: Focused | null) => (f ? `${f.role || f.tag}${f.type ? `[${f.type}]` : ''} “${f.name.slice(0, 60)}”` : '(nothing)');

type Want = RegExp | { name?: RegExp; tag?: string; type?: string };
function fits(f: Focused | null, want: Want): f is Focused {
  if (!f) return false;
  if (want instanceof RegExp) return want.test(f.name);
  return (!want.name || want.name.test(f.name)) && (!want.tag || want.tag === f.tag) && (!want.type || want.type === f.type);
}

/** The keyboard of one page, keeping a record of every Tab stop that showed no focus. */
class Keyboard {
  readonly unringed: string[] = [];
  constructor(readonly page: Page) {}

  async press(key: string): Promise<void> {
    await this.page.keyboard.press(key);
  }

  async type(text: string): Promise<void> {
    await this.page.keyboard.type(text);
  }

  /** One Tab (or Shift+Tab); a stop without a visible ring is written down. */
  async tab(back = false): Promise<Focused | null> {
    await this.page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
    const now = await focused(this.page);
    if (now && (!now.ring || !now.shown)) this.unringed.push(`${new URL(this.page.url()).pathname}: ${describeStop(now)}`);
    return now;
  }

  /** Tabs on until the wanted control has focus; fails naming the stops it passed. */
  async tabTo(want: Want, { back = false, max = 80 } = {}): Promise<Focused> {
    const passed: string[] = [];
    for (let i = 0; i < max; i += 1) {
      const now = await this.tab(back);
      if (fits(now, want)) return now;
      passed.push(describeStop(now));
    }
    throw new Error(`${max} × ${back ? 'Shift+Tab' : 'Tab'} never reached ${String(want instanceof RegExp ? want : JSON.stringify(want))}; the last stops: ${passed.slice(-15).join(' · ')}`);
  }

  /** On a focused closed <select>: arrow keys up or down to the option whose text starts with `label`. */
  async choose(label: string): Promise<void> {
    const { from, to, enabled } = await this.page.evaluate((wanted) => {
      const select = document.activeElement;
      if (!(select instanceof HTMLSelectElement)) throw new Error('No select has focus.');
      const options = [...select.options];
      return {
        from: select.selectedIndex,
        to: options.findIndex((o) => o.text.trim().startsWith(wanted)),
        enabled: options.map((o) => !o.disabled),
      };
    }, label);
    if (to < 0) throw new Error(`No option “${label}” in the focused select.`);
    const [lo, hi] = from < to ? [from, to] : [to, from];
    const steps = enabled.slice(lo + 1, hi + 1).filter(Boolean).length;
    const selected = () => this.page.evaluate(() => (document.activeElement as HTMLSelectElement).selectedIndex);
    for (let i = 0; i < steps; i += 1) {
      // One step at a time, as a person watching the choice would: a select whose value lives in
      // the address settles only after the navigation its change starts.
      const before = await selected();
      await this.press(from < to ? 'ArrowDown' : 'ArrowUp');
      await expect.poll(selected, WAIT).not.toBe(before);
    }
    await expect.poll(() => this.page.evaluate(() => (document.activeElement as HTMLSelectElement).selectedOptions[0]?.text.trim() ?? '')).toMatch(new RegExp(`^${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`));
  }

  /** After a link or a form took the page elsewhere: the new page is shown and focus starts at its content. */
  async arrive(heading: string): Promise<void> {
    await this.page.getByRole('heading', { level: 1, name: heading }).waitFor(WAIT);
    await this.expectFocus({ tag: 'main' });
  }

  async expectFocus(want: Want): Promise<void> {
    await expect.poll(async () => {
      const now = await focused(this.page);
      return fits(now, want) ? 'there' : describeStop(now);
    }, WAIT).toBe('there');
  }
}

/** Signs in on the sign-in page with the keyboard; the page is left where the app sends it. */
async function signInByKeyboard(keys: Keyboard, person: FreshPerson): Promise<void> {
  await keys.tabTo({ tag: 'input', name: /^E-mail/ });
  await keys.type(person.email);
  await keys.tabTo({ tag: 'input', name: /^Password/ });
  await keys.type(person.password);
  await keys.press('Enter');
  await keys.page.waitForURL((url) => url.pathname !== '/sign-in', WAIT);
  await keys.expectFocus({ tag: 'main' });
}

let browser: Browser;
const contexts: BrowserContext[] = [];
let grower: FreshPerson;
let mentor: FreshPerson;
let photo: Buffer;
const run = stamp();
const TITLE = `Quince juice weeping musty through the muslin ${run}`;

beforeAll(async () => {
  browser = await launch();
  [grower, mentor] = await Promise.all([freshPerson(browser, 'grower', 'Wren'), freshPerson(browser, 'mentor', 'Tamsin')]);
  // A small photo: only the keyboard's way to the picker is under test here, not the shrinking.
  photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 170, g: 150, b: 90 } } }).jpeg().toBuffer();
});

afterAll(async () => {
  for (const context of contexts) await context.close();
  await browser?.close();
});

async function keyboardOn(device: typeof DESKTOP | typeof PHONE): Promise<Keyboard> {
  const context = await newContext(browser, device);
  contexts.push(context);
  return new Keyboard(await context.newPage());
}

describe('keyboard alone', () => {
  test('when a visitor presses Tab first, then a visible skip link leads past the header into the page', async () => {
    const keys = await keyboardOn(DESKTOP);
    await keys.page.goto('/library');
    await keys.page.locator('main h1').waitFor(WAIT);
    const first = await keys.tab();
    expect(first?.name).toBe('Skip to main content');
    const box = await keys.page.getByRole('link', { name: 'Skip to main content' }).boundingBox();
    // Shown on focus, not just read out: a sighted keyboard user sees where they are.
    expect(box?.width).toBeGreaterThan(40);
    expect(box?.height).toBeGreaterThan(20);
    await keys.press('Enter');
    await keys.expectFocus({ tag: 'main' });
    // The next stop is inside the page, not back in the header.
    await keys.tab();
    expect(await keys.page.evaluate(() => document.querySelector('main')!.contains(document.activeElement))).toBe(true);
    expect(keys.unringed).toEqual([]);
  });

  test('when the phone menu is opened from the keyboard, then focus moves into it and Escape brings it back to the button', async () => {
    const keys = await keyboardOn(PHONE);
    await keys.page.goto('/');
    await keys.page.locator('main h1').waitFor(WAIT);
    await keys.tabTo(/^Menu$/, { max: 5 });
    await keys.press('Enter');
    await keys.expectFocus(/^Field Library$/);
    await keys.press('Escape');
    await keys.expectFocus(/^Menu$/);
    expect(await keys.page.getByRole('button', { name: 'Menu' }).getAttribute('aria-expanded')).toBe('false');
    expect(keys.unringed).toEqual([]);
  });

  test('when a grower and a mentor work a case from start to finish with the keyboard, then every step goes through and every stop shows focus', async () => {
    // The grower signs in from the landing page.
    const g = await keyboardOn(DESKTOP);
    await g.page.goto('/');
    await g.page.locator('main h1').waitFor(WAIT);
    await g.tabTo(/^Sign in$/, { max: 10 });
    await g.press('Enter');
    await g.arrive('Sign in');
    await signInByKeyboard(g, grower);

    // Records a batch, from the batch shelf (where signing in may already have led).
    if (new URL(g.page.url()).pathname !== '/batches') {
      await g.tabTo(/^Batch shelf$/, { back: true, max: 20 });
      await g.press('Enter');
    }
    await g.arrive('Batch shelf');
    await g.tabTo(/^Add a batch$/);
    await g.press('Enter');
    await g.arrive('Add a batch');
    await g.tabTo({ tag: 'select', name: /^Stage/ });
    await g.choose('FFJ');
    await g.tabTo({ tag: 'input', name: /^Label/ });
    await g.type(`Quince crock ${run}`);
    await g.tabTo({ tag: 'textarea', name: /^Ingredients/ });
    await g.type('Ripe quinces from the hedge, sliced, packed with brown sugar.');
    await g.tabTo({ tag: 'input', name: /^Culture weight, amount/ });
    await g.type('1200');
    await g.tabTo({ tag: 'input', name: /^Sugar weight, amount/ });
    await g.type('1200');
    await g.tabTo(/^Put it on the shelf$/);
    await g.press('Enter');
    await g.page.waitForURL(/\/batches\/\d+$/, WAIT);
    await g.arrive(`Quince crock ${run}`);

    // Opens a case about it: symptom chips with Space, the photo picker opened from the keyboard.
    await g.tabTo(/^Open a case about this batch$/);
    await g.press('Enter');
    await g.arrive('Open a case');
    const musty = await g.tabTo({ type: 'checkbox', name: /^Musty/ });
    expect(musty.checked).toBe(false);
    await g.press('Space');
    expect((await focused(g.page))?.checked).toBe(true);
    await g.tabTo({ type: 'checkbox', name: /^Free liquid pooling/ });
    await g.press('Space');
    expect((await focused(g.page))?.checked).toBe(true);
    await g.tabTo({ tag: 'textarea', name: /^Describe it in your own words/ });
    await g.type('Since Sunday a brown liquid has pooled under the fruit and the crock smells musty, like a damp cellar.');
    // The page's file-chooser interception is a protocol call of its own: it is switched on (by
    // listening) and given time to take effect before Space, so the chooser Space opens is never
    // a native dialog nobody sees. If none came (a busy machine), Space is pressed once more.
    const choosers: FileChooser[] = [];
    g.page.on('filechooser', (c) => choosers.push(c));
    await g.page.waitForTimeout(300);
    await g.tabTo({ tag: 'input', type: 'file' });
    await g.press('Space');
    const chooserCame = () => expect.poll(() => choosers.length, { timeout: 8_000 }).toBeGreaterThan(0);
    await chooserCame().catch(async () => {
      expect((await focused(g.page))?.type).toBe('file');
      await g.press('Space');
      await expect.poll(() => choosers.length, WAIT).toBeGreaterThan(0);
    });
    await choosers[0].setFiles({ name: 'crock.jpg', mimeType: 'image/jpeg', buffer: photo });
    await expect.poll(() => g.page.getByText(/^Ready, /).isVisible(), WAIT).toBe(true);
    await g.tabTo({ tag: 'input', name: /^Title/ });
    await g.type(TITLE);
    await g.tabTo(/^Open the case$/);
    await g.press('Enter');
    await g.page.waitForURL(/\/cases\/\d+$/, { timeout: 30_000 });
    const caseId = Number(new URL(g.page.url()).pathname.split('/').pop());
    await g.arrive(TITLE);

    // The photo opens larger from the keyboard, and Escape returns focus to its thumbnail.
    await g.tabTo(/^Photo 1 of 1/);
    await g.press('Enter');
    await expect.poll(() => g.page.getByRole('dialog', { name: 'Photo 1 of 1' }).isVisible(), WAIT).toBe(true);
    await g.expectFocus(/^Close$/);
    await g.press('Escape');
    await expect.poll(() => g.page.getByRole('dialog').count(), WAIT).toBe(0);
    await g.expectFocus(/^Photo 1 of 1/);

    // A message in the thread: Enter sends.
    const hello = `The cloth is damp too; shall I change it? (${run})`;
    await g.tabTo({ tag: 'textarea', name: /^Write to/ });
    await g.type(hello);
    await g.press('Enter');
    const log = g.page.getByRole('log', { name: 'Messages' });
    await expect.poll(() => log.getByText(hello, { exact: true }).count(), WAIT).toBe(1);
    await g.expectFocus({ tag: 'textarea', name: /^Write to/ });

    // Withdrawing asks first; focus goes to the question and back when the grower keeps the case.
    await g.tabTo(/^Withdraw this case$/, { back: true });
    await g.press('Enter');
    await g.expectFocus(/^Keep it open$/);
    await g.press('Enter');
    await g.expectFocus(/^Withdraw this case$/);

    // The mentor signs in, claims the case on the rounds and closes it with the closing form.
    const m = await keyboardOn(DESKTOP);
    await m.page.goto('/sign-in');
    await m.page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor(WAIT);
    await signInByKeyboard(m, mentor);
    // A mentor starts at the rounds (where signing in leads when no other page was asked for).
    if (new URL(m.page.url()).pathname !== '/rounds') {
      await m.tabTo(/^Rounds$/, { back: true, max: 20 });
      await m.press('Enter');
    }
    await m.arrive('Rounds');
    await m.tabTo({ tag: 'select', name: /^Order/ });
    await m.choose('Newest first');
    await m.page.waitForURL(/sort=newest/, WAIT);
    await m.tabTo(new RegExp(`^Claim “${TITLE}”$`), { max: 120 });
    await m.press('Enter');
    const row = m.page.getByRole('row').filter({ has: m.page.getByRole('link', { name: TITLE, exact: true }) });
    await expect.poll(() => row.getByText('You', { exact: true }).count(), WAIT).toBe(1);
    // The claim button is gone; focus is not lost with it but lands on the case it claimed.
    await m.expectFocus(new RegExp(`^${TITLE}$`));
    await shot(m.page, 'keyboard-rounds-claimed-desktop');
    await m.press('Enter');
    await m.page.waitForURL(new RegExp(`/cases/${caseId}$`), WAIT);
    await m.arrive(TITLE);
    await m.tabTo(/^Close the case…$/, { max: 120 });
    await m.press('Enter');
    // The form takes focus at its first field rather than leaving it on a button that went away.
    await m.expectFocus({ tag: 'select', name: /^Likely cause/ });
    await shot(m.page, 'keyboard-closing-form-desktop');
    await m.choose('Too wet');
    await m.tabTo({ tag: 'select', name: /^Remedy to try/ });
    await m.choose('Drain the free liquid');
    await m.tabTo({ tag: 'textarea', name: /^How to do it/ });
    await m.type('Tip the crock, pour the pooled liquid off into a clean bottle, and swap the damp muslin for a dry one.');
    await m.tabTo({ tag: 'textarea', name: /^Summary in plain words/ });
    await m.type('Too much juice drew out and sat under the fruit; drained and given a dry cloth, the quince should come back within days.');
    await m.tabTo(/^Close and start watching$/);
    await m.press('Enter');
    await expect.poll(() => m.page.getByText('Closed: the case is now watching').isVisible(), WAIT).toBe(true);
    await m.expectFocus(/^Closed: the case is now watching/);
    await shot(m.page, 'keyboard-case-closed-desktop');

    // The grower files the recovery report from the case page.
    await g.page.goto(`/cases/${caseId}`);
    await g.page.getByRole('heading', { level: 1, name: TITLE }).waitFor(WAIT);
    await g.tabTo(/^File the recovery report$/);
    await g.press('Enter');
    await g.arrive('How did the batch do?');
    await g.tabTo({ type: 'radio', name: /^Recovered/ });
    await g.press('Space');
    expect((await focused(g.page))?.checked).toBe(true);
    // Tab leaves the outcome group for the stars; arrows move along the stars.
    const star = await g.tab();
    expect(star?.name).toMatch(/^1 star/);
    for (let i = 0; i < 4; i += 1) await g.press('ArrowRight');
    await g.expectFocus({ type: 'radio', name: /^5 stars/ });
    expect((await focused(g.page))?.checked).toBe(true);
    await g.tabTo({ tag: 'textarea', name: /^Anything to add/ });
    await g.type('Drained it the same evening; two days later it smells of quince again.');
    await g.tabTo({ type: 'checkbox', name: /^Share this case in the Field Library/ });
    await g.press('Space');
    await g.tabTo(/^Send the report$/);
    await g.press('Enter');
    await g.page.getByRole('heading', { level: 1, name: 'Thank you, the report is in' }).waitFor(WAIT);
    // The form went away with its button; focus starts again at the top of the page's content.
    await g.expectFocus({ tag: 'main' });
    await g.tabTo(/^Read the field note$/, { max: 5 });

    // A visitor searches the Field Library and opens the new field note.
    const v = await keyboardOn(DESKTOP);
    await v.page.goto('/library');
    await v.page.getByRole('heading', { level: 1, name: 'Field Library' }).waitFor(WAIT);
    await v.tabTo({ tag: 'input', name: /^Search in your own words/ });
    await v.type(`quince muslin ${run}`);
    await v.press('Enter');
    await expect.poll(() => v.page.getByRole('link', { name: TITLE, exact: true }).isVisible(), WAIT).toBe(true);
    await v.tabTo(new RegExp(`^${TITLE}$`));
    await v.press('Enter');
    await v.arrive(TITLE);
    await shot(v.page, 'keyboard-field-note-desktop');

    expect([...g.unringed, ...m.unringed, ...v.unringed]).toEqual([]);
  });
});
