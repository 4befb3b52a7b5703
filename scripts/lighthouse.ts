// `npm run lighthouse`: Lighthouse (Debian's Chromium) on the main screens, printed as a table
// with the budgets from QUALITY.md beside each score. A report, not a gate in `npm test`.
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../server/src/db/sequelize';
import { startServer } from '../server/src/index';
import { buildClientIfStale, localDatabase, sessionSecret } from './local-env';

const say = (line: string) => console.log(`[lighthouse] ${line}`);
const BUDGET = { performance: 90, accessibility: 100, 'best-practices': 95 } as const;

async function main(): Promise<void> {
  const db = await localDatabase(say);
  buildClientIfStale(say);
  const server = await startServer({
    env: { ...process.env, PORT: '0', DATABASE_URL: db.url, SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret(), LOG_LEVEL: 'error' },
    seedDemo: true,
  });
  const chrome = await chromeLauncher.launch({
    chromePath: process.env.CHROME_PATH ?? '/usr/bin/chromium',
    chromeFlags: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
  });
  try {
    const login = await fetch(`${server.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Origin: server.url },
      body: JSON.stringify({ email: 'grower@example.test', password: 'sporewell-demo' }),
    });
    const cookie = login.headers.get('set-cookie')?.split(';')[0] ?? '';
    const [someCase] = await getSequelize().query<{ id: number }>(
      `SELECT c.id FROM cases c JOIN users u ON u.id = c.grower_id WHERE u.email = 'grower@example.test' ORDER BY c.id LIMIT 1`,
      { type: QueryTypes.SELECT },
    );
    const screens: { name: string; path: string; signedIn: boolean }[] = [
      { name: 'landing', path: '/', signedIn: false },
      { name: 'open a case', path: '/cases/new', signedIn: true },
      ...(someCase ? [{ name: 'case', path: `/cases/${someCase.id}`, signedIn: true }] : []),
      { name: 'Field Library', path: '/library', signedIn: false },
    ];
    const rows: string[][] = [];
    for (const screen of screens) {
      const result = await lighthouse(`${server.url}${screen.path}`, {
        port: chrome.port,
        output: 'json',
        logLevel: 'error',
        onlyCategories: ['performance', 'accessibility', 'best-practices'],
        extraHeaders: screen.signedIn ? { Cookie: cookie } : undefined,
        // Loopback has no real network: measure with Lighthouse's default simulated mobile throttling.
      });
      const categories = result?.lhr.categories ?? {};
      const score = (id: keyof typeof BUDGET) => Math.round((categories[id]?.score ?? 0) * 100);
      rows.push([
        screen.name,
        ...(['performance', 'accessibility', 'best-practices'] as const).map((id) => `${score(id)} ${score(id) >= BUDGET[id] ? '(ok)' : `(budget ${BUDGET[id]}: MISSES)`}`),
      ]);
    }
    const header = ['screen', `performance ≥ ${BUDGET.performance}`, `accessibility ${BUDGET.accessibility}`, `best practices ≥ ${BUDGET['best-practices']}`];
    const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
    const line = (cells: string[]) => `| ${cells.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
    console.log(line(header));
    console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
    for (const row of rows) console.log(line(row));
  } finally {
    await chrome.kill();
    await server.close();
    db.release();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
