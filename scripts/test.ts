// `npm test`: a throw-away PostgreSQL cluster in a temporary folder, every test project, and
// the cluster stopped and removed afterwards, even on failure. Extra arguments go to vitest
// (e.g. `npm test -- --project unit`).
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureDatabase, startCluster, stopCluster } from '../server/src/lib/local-postgres';
import { ROOT } from './local-env';

const say = (line: string) => console.log(`[test] ${line}`);

async function main(): Promise<number> {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sporewell-test-'));
  fs.chmodSync(tmp, 0o755);
  let dataDir: string | null = null;
  const cleanup = () => {
    if (dataDir) stopCluster(dataDir, 'immediate');
    dataDir = null;
    fs.rmSync(tmp, { recursive: true, force: true });
  };
  process.on('SIGINT', () => {
    cleanup();
    process.exit(130);
  });
  process.on('SIGTERM', () => {
    cleanup();
    process.exit(143);
  });
  try {
    const cluster = await startCluster({ dataDir: path.join(tmp, 'pg'), metaFile: path.join(tmp, 'pg.json'), say });
    dataDir = cluster.dataDir;
    say(`Throw-away PostgreSQL on 127.0.0.1:${cluster.port}`);
    await ensureDatabase(cluster, 'sporewell_test');
    await ensureDatabase(cluster, 'sporewell_e2e');
    const resultsDir = path.join(ROOT, 'test-results');
    fs.mkdirSync(resultsDir, { recursive: true });
    const jsonFile = path.join(resultsDir, 'vitest.json');
    fs.rmSync(jsonFile, { force: true });
    const env = {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: cluster.url('sporewell_test'),
      E2E_DATABASE_URL: cluster.url('sporewell_e2e'),
      PG_ADMIN_URL: cluster.url('postgres'),
      PG_DATA_DIR: cluster.dataDir,
      SESSION_SECRET: 'test-secret-that-is-long-enough-for-zod-1234',
      UPLOAD_DIR: path.join(tmp, 'uploads'),
      TEST_TMP: tmp,
      LOG_LEVEL: process.env.LOG_LEVEL ?? 'silent',
    };
    const args = ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${jsonFile}`, ...process.argv.slice(2)];
    const code = await new Promise<number>((resolve) => {
      const child = spawn(process.execPath, [path.join(ROOT, 'node_modules/vitest/vitest.mjs'), ...args], { cwd: ROOT, env, stdio: 'inherit' });
      child.on('exit', (c, signal) => resolve(c ?? (signal ? 1 : 0)));
    });
    printSummary(jsonFile);
    return code;
  } finally {
    cleanup();
  }
}

function printSummary(jsonFile: string): void {
  if (!fs.existsSync(jsonFile)) {
    console.log('0 passed, 1 failed');
    return;
  }
  const report = JSON.parse(fs.readFileSync(jsonFile, 'utf8')) as { numPassedTests: number; numFailedTests: number; numPendingTests?: number; testResults?: { status: string; message?: string }[] };
  // A test file that failed to load counts as a failure even though it ran no test.
  const brokenFiles = (report.testResults ?? []).filter((f) => f.status === 'failed' && /Failed to|Error/.test(f.message ?? '')).length;
  const failed = report.numFailedTests + brokenFiles;
  console.log(`${report.numPassedTests} passed, ${failed} failed${report.numPendingTests ? `, ${report.numPendingTests} skipped` : ''}`);
}

main().then(
  (code) => process.exit(code),
  (error) => {
    console.error(`[test] ${(error as Error).stack ?? error}`);
    console.log('0 passed, 1 failed');
    process.exit(1);
  },
);
