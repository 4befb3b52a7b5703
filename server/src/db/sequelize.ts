// One Sequelize instance per process. Connection errors are retried for a short while, so a
// PostgreSQL restart costs the requests in the gap (a 503 each) and not the process.
import { Sequelize } from 'sequelize';
import { AppError, databaseUnavailable, serverBusy } from '../lib/errors';

let instance: Sequelize | null = null;

const CONNECTION_ERRORS = [
  /ECONNREFUSED/,
  /ECONNRESET/,
  /Connection terminated/,
  /the database system is (starting up|shutting down)/,
  /terminating connection due to administrator command/,
  /SequelizeConnectionError/,
  /SequelizeConnectionRefusedError/,
  /SequelizeConnectionAcquireTimeoutError/,
];

export function createSequelize(databaseUrl: string, options: { poolMax?: number } = {}): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: options.poolMax ?? 10, min: 0, idle: 10_000, acquire: 5_000, evict: 1_000 },
    // Retrying is only safe for work that may run twice; Sequelize retries a query only when it
    // failed to reach the server, before anything ran.
    retry: { max: 2, match: CONNECTION_ERRORS, backoffBase: 200, backoffExponent: 1.5 },
    define: { underscored: true, timestamps: true },
    dialectOptions: { application_name: 'sporewell' },
  });
}

export function initSequelize(databaseUrl: string, options: { poolMax?: number } = {}): Sequelize {
  if (instance) return instance;
  instance = createSequelize(databaseUrl, options);
  return instance;
}

export function getSequelize(): Sequelize {
  if (!instance) throw new Error('The database is not initialised yet.');
  return instance;
}

export async function closeSequelize(): Promise<void> {
  if (instance) {
    const closing = instance;
    instance = null;
    await closing.close();
  }
}

export function isConnectionError(error: unknown): boolean {
  const e = error as { name?: string; message?: string; original?: { code?: string } } | null;
  if (!e) return false;
  if (e.name && /Connection(Refused|Acquire|Timed|Error)|HostNotReachable/.test(e.name)) return true;
  const code = e.original?.code ?? (e as { code?: string }).code;
  if (code && ['ECONNREFUSED', 'ECONNRESET', '57P01', '57P02', '57P03', '08006', '08001', '08003'].includes(code)) return true;
  return /Connection terminated|ECONNREFUSED|terminating connection/.test(e.message ?? '');
}

/** What a failure to reach the database answers (HTTP and socket alike), or null for any other error. */
export function databaseAnswer(error: unknown): AppError | null {
  if ((error as Error | null)?.name === 'SequelizeConnectionAcquireTimeoutError') return serverBusy();
  return isConnectionError(error) ? databaseUnavailable() : null;
}
