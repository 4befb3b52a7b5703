import { chromium } from 'playwright-core';
import fs from 'node:fs';
const [role, ...paths] = process.argv.slice(2);
const W = process.env.WIDTH ? Number(process.env.WIDTH) : 390;
const H = W === 390 ? 844 : 800;
const base = 'http://127.0.0.1:3999';
fs.mkdirSync('/tmp/walk', { recursive: true });
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'] });
const ctx = await browser.newContext({ baseURL: base, viewport: { width: W, height: H }, deviceScaleFactor: 1 });
const page = await ctx.newPage();
const errors = [];
page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
if (role !== 'visitor') {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(`${role}@example.test`);
  await page.getByLabel('Password', { exact: true }).fill('sporewell-demo');
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 20000 });
}
for (const p of paths) {
  await page.goto(p);
  await page.waitForLoadState('networkidle');
  await page.waitForTimeout(500);
  const name = `${role}${p.replace(/[^a-z0-9]+/gi, '_')}-${W}`;
  await page.screenshot({ path: `/tmp/walk/${name}.png`, fullPage: true });
  const text = await page.locator('main').innerText().catch(() => page.locator('body').innerText());
  console.log(`===== ${p} (${name}.png)\n${text.slice(0, Number(process.env.CHARS ?? 4000))}`);
}
if (errors.length) console.log('CONSOLE ERRORS', errors);
await browser.close();
