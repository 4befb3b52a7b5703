// The least any "stored first" delivery can cost on this machine: one committed one-row INSERT
// into an ordinary (WAL-logged) table of the bench's own database, from the query's send to its
// answer, over one connection from this process. No post can be acknowledged sooner than that,
// so bare delivery plus this floor is the best the live thread could show with any schema.
// Sent both back to back and paced (a core that has idled answers later on this VM).
import { performance } from 'node:perf_hooks';
import pg from 'pg';
import { percentiles } from './stats';

export interface CommitFloor {
  backToBack: ReturnType<typeof percentiles>;
  paced: ReturnType<typeof percentiles>;
  pacedRatePerSecond: number;
}

export async function measureCommitFloor(databaseUrl: string, opts: { count: number; pacedRatePerSecond: number; pacedCount: number }): Promise<CommitFloor> {
  const client = new pg.Client({ connectionString: databaseUrl, application_name: 'sporewell-bench-commit-floor' });
  await client.connect();
  const table = `bench_commit_floor_${process.pid}`;
  try {
    await client.query(`CREATE TABLE ${table} (id bigserial PRIMARY KEY, body text NOT NULL)`);
    const insert = { name: 'bench_commit_floor', text: `INSERT INTO ${table} (body) VALUES ($1)` };
    const once = async (i: number) => {
      const started = performance.now();
      await client.query({ ...insert, values: [`floor ${i}`] });
      return performance.now() - started;
    };
    for (let i = 0; i < 50; i += 1) await once(i); // connection and plan warmed, not timed
    const backToBack: number[] = [];
    for (let i = 0; i < opts.count; i += 1) backToBack.push(await once(i));
    const paced: number[] = [];
    const gap = 1000 / opts.pacedRatePerSecond;
    for (let i = 0; i < opts.pacedCount; i += 1) {
      const due = performance.now() + gap;
      paced.push(await once(i));
      await new Promise((resolve) => setTimeout(resolve, Math.max(0, due - performance.now())));
    }
    return { backToBack: percentiles(backToBack), paced: percentiles(paced), pacedRatePerSecond: opts.pacedRatePerSecond };
  } finally {
    await client.query(`DROP TABLE IF EXISTS ${table}`).catch(() => undefined);
    await client.end();
  }
}
