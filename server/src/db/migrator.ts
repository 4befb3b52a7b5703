// Schema changes are umzug migrations in db/migrations (never sequelize.sync()). Each file
// exports `up` (and `down` where it can be undone) taking { context: QueryInterface }.
// Files are named NNNN-what.ts and run in name order. A PostgreSQL advisory lock keeps two
// processes that start at once from migrating together.
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';

const here = path.dirname(fileURLToPath(import.meta.url));
export type Migration = { context: QueryInterface };
const MIGRATION_LOCK = 727_001;

export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: {
      glob: ['migrations/*.{ts,js}', { cwd: here, ignore: ['**/*.d.ts'] }],
      resolve: ({ name, path: file, context }) => ({
        name: name.replace(/\.(ts|js)$/, ''),
        up: async () => (await import(pathToFileURL(file!).href)).up({ context }),
        down: async () => {
          const mod = await import(pathToFileURL(file!).href);
          if (!mod.down) throw new Error(`${name} cannot be undone.`);
          return mod.down({ context });
        },
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function migrate(sequelize: Sequelize): Promise<string[]> {
  return withAdvisoryLock(sequelize, MIGRATION_LOCK, async () => {
    const done = await createMigrator(sequelize).up();
    return done.map((m) => m.name);
  });
}

/** Runs `work` holding a session-level advisory lock on one pinned connection. */
export async function withAdvisoryLock<T>(sequelize: Sequelize, key: number, work: () => Promise<T>): Promise<T> {
  const pool = (sequelize.connectionManager as unknown as { getConnection(): Promise<unknown>; releaseConnection(c: unknown): Promise<void> });
  const connection = (await pool.getConnection()) as { query(sql: string, params?: unknown[]): Promise<unknown> };
  try {
    await connection.query('SELECT pg_advisory_lock($1)', [key]);
    try {
      return await work();
    } finally {
      await connection.query('SELECT pg_advisory_unlock($1)', [key]);
    }
  } finally {
    await pool.releaseConnection(connection);
  }
}
