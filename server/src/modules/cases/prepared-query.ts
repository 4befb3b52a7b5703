// A read-only query as a named prepared statement on one of Sequelize's pooled connections.
// "Batches like this" runs the same few large statements over and over; PostgreSQL planning
// them afresh each time cost about a quarter of the query (measured with scripts/bench-similar.ts),
// and Sequelize's own handling of a 4 kB statement adds to it. Values are `$name` placeholders,
// as with Sequelize's `bind`; a name without a value stays as it is.
import crypto from 'node:crypto';
import { getSequelize } from '../../db/sequelize';

interface PooledClient {
  query(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: unknown[] }>;
}

interface ConnectionManager {
  getConnection(options?: { type?: 'read' | 'write' }): Promise<PooledClient>;
  releaseConnection(connection: PooledClient): Promise<void>;
}

const names = new Map<string, string>();

export function toPositional(sql: string, values: Record<string, unknown>): { text: string; ordered: unknown[] } {
  const seen = new Map<string, number>();
  const ordered: unknown[] = [];
  const text = sql.replace(/\B\$(\w+)/g, (match, key: string) => {
    if (!(key in values)) return match;
    if (!seen.has(key)) {
      ordered.push(values[key]);
      seen.set(key, ordered.length);
    }
    return `$${seen.get(key)}`;
  });
  return { text, ordered };
}

export async function preparedQuery<T>(sql: string, values: Record<string, unknown>): Promise<T[]> {
  const { text, ordered } = toPositional(sql, values);
  let name = names.get(text);
  if (!name) {
    name = `sporewell_${crypto.createHash('sha1').update(text).digest('hex').slice(0, 16)}`;
    names.set(text, name);
  }
  const manager = getSequelize().connectionManager as unknown as ConnectionManager;
  const connection = await manager.getConnection({ type: 'read' });
  try {
    return (await connection.query({ name, text, values: ordered })).rows as T[];
  } finally {
    await manager.releaseConnection(connection);
  }
}
