// `npm run lighthouse`: Lighthouse (Debian's Chromium) on the main screens, printed as a table
// with the budgets from QUALITY.md beside each score. A report, not a gate in `npm test`.
// LIGHTHOUSE_RUNS=3 measures each screen three times and prints the median (scores move with the
// machine's load, printed beside them); every run's JSON report goes to test-results/lighthouse/.
// LIGHTHOUSE_SCREENS=case,landing measures only those screens.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../server/src/db/sequelize';
import { startServer } from '../server/src/index';
import { buildClientIfStale, localDatabase, ROOT, sessionSecret } from './local-env';

const say = (line: string) => console.log(`[lighthouse] ${line}`);
const BUDGET = { performance: 90, accessibility: 100, 'best-practices': 95 } as const;
const RUNS = Math.max(1, Number(process.env.LIGHTHOUSE_RUNS ?? 1) || 1);
const REPORTS = path.join(ROOT, 'test-results/lighthouse');
const METRICS = ['first-contentful-paint', 'largest-contentful-paint', 'total-blocking-time', 'cumulative-layout-shift', 'speed-index'] as const;
const METRIC_NAMES: Record<(typeof METRICS)[number], string> = {
  'first-contentful-paint': 'FCP',
  'largest-contentful-paint': 'LCP',
  'total-blocking-time': 'TBT',
  'cumulative-layout-shift': 'CLS',
  'speed-index': 'SI',
};

// Lighthouse's own list (core/config/constants.js) and the cookies.
const VISITOR_CLEARS = ['file_systems', 'shader_cache', 'service_workers', 'cache_storage', 'cookies'] as const;
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const loadAverage = () => os.loadavg().map((l) => l.toFixed(2)).join(' ');

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
    fs.mkdirSync(REPORTS, { recursive: true });
    const rows: string[][] = [];
    // LIGHTHOUSE_SCREENS=case,landing measures only those (by name, as in the table).
    const only = process.env.LIGHTHOUSE_SCREENS ? process.env.LIGHTHOUSE_SCREENS.split(',').map((s) => s.trim().toLowerCase()) : undefined;
    for (const screen of screens.filter((s) => !only || only.includes(s.name.toLowerCase()))) {
      const runs: { scores: Record<keyof typeof BUDGET, number>; metrics: number[]; load: string }[] = [];
      for (let run = 1; run <= RUNS; run += 1) {
        let load = loadAverage();
        const measure = () =>
          lighthouse(`${server.url}${screen.path}`, {
            port: chrome.port,
            output: 'json',
            logLevel: 'error',
            onlyCategories: ['performance', 'accessibility', 'best-practices'],
            extraHeaders: screen.signedIn ? { Cookie: cookie } : undefined,
            // A visitor's screen starts without cookies. Every signed-in answer sets the session
            // cookie again (it rolls), so after the signed-in screens Chromium's jar holds it, and
            // Lighthouse keeps cookies between runs unless told: the Field Library was measured
            // signed in (the unread counts and the live connection with it).
            ...(screen.signedIn ? {} : { clearStorageTypes: [...VISITOR_CLEARS] }),
            // Loopback has no real network: measure with Lighthouse's default simulated mobile throttling.
          });
        let result = await measure();
        // A run Lighthouse could not record (NO_NAVSTART and the like, common on a busy machine)
        // measured nothing and would count as 0: it is run again, at most twice.
        for (let retry = 0; retry < 2 && result?.lhr.runtimeError; retry += 1) {
          say(`${screen.name} run ${run}: ${result.lhr.runtimeError.code}, running it again`);
          load = loadAverage();
          result = await measure();
        }
        if (!result) throw new Error(`Lighthouse returned nothing for ${screen.path}.`);
        const slug = screen.name.replace(/\W+/g, '-');
        fs.writeFileSync(path.join(REPORTS, `${slug}-${run}.json`), typeof result.report === 'string' ? result.report : result.report.join(''));
        const categories = result.lhr.categories;
        const score = (id: keyof typeof BUDGET) => Math.round((categories[id]?.score ?? 0) * 100);
        const scores = { performance: score('performance'), accessibility: score('accessibility'), 'best-practices': score('best-practices') };
        const metrics = METRICS.map((id) => result.lhr.audits[id]?.numericValue ?? NaN);
        runs.push({ scores, metrics, load });
        say(
          `${screen.name} run ${run}/${RUNS} (load ${load}): performance ${scores.performance}, ` +
            METRICS.map((id, i) => `${METRIC_NAMES[id]} ${id === 'cumulative-layout-shift' ? metrics[i].toFixed(3) : `${Math.round(metrics[i])} ms`}`).join(', '),
        );
      }
      const mid = (id: keyof typeof BUDGET) => median(runs.map((r) => r.scores[id]));
      rows.push([
        screen.name,
        ...(['performance', 'accessibility', 'best-practices'] as const).map((id) => `${mid(id)} ${mid(id) >= BUDGET[id] ? '(ok)' : `(budget ${BUDGET[id]}: MISSES)`}`),
        RUNS > 1 ? runs.map((r) => r.scores.performance).join(' / ') : '',
        runs.map((r) => r.load.split(' ')[0]).join(' / '),
      ]);
    }
    const header = ['screen', `performance ≥ ${BUDGET.performance}`, `accessibility ${BUDGET.accessibility}`, `best practices ≥ ${BUDGET['best-practices']}`, 'performance per run', 'load (1 min)'];
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
