// The socket.io PostgreSQL adapter sends each broadcast between processes as a NOTIFY; a
// payload over 8000 bytes (NOTIFY's limit) or with binary data goes in this table instead and
// the NOTIFY carries only its id. Every process deletes rows older than 30 s, hence the index.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`CREATE TABLE socket_io_attachments (
    id bigserial PRIMARY KEY,
    created_at timestamptz NOT NULL DEFAULT now(),
    payload bytea
  )`);
  await q(`CREATE INDEX socket_io_attachments_created_at_idx ON socket_io_attachments (created_at)`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP TABLE IF EXISTS socket_io_attachments`);
}
