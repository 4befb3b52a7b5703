// A database of a test file's own on the run's throw-away cluster, for tests that need one
// empty (migrations, the demo seed, several processes) rather than the shared API database.
import pg from 'pg';

/** Runs `work` on a connection with the admin rights of the run's cluster. */
export async function admin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: process.env.PG_ADMIN_URL });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

export interface FreshDatabase {
  name: string;
  url: string;
  drop(): Promise<void>;
}

/** Creates `sporewell_<label>_<pid>` next to the API database; `drop()` removes it, connections and all. */
export async function createFreshDatabase(label: string): Promise<FreshDatabase> {
  const base = new URL(process.env.DATABASE_URL!);
  const name = `sporewell_${label}_${process.pid}`;
  await admin((c) => c.query(`CREATE DATABASE ${name}`));
  base.pathname = `/${name}`;
  return { name, url: base.toString(), drop: () => admin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)).then(() => undefined) };
}
