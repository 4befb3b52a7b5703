// What lets PostgreSQL rank library candidates the way fuse.js will score them (library-ranking.ts):
// a word vector per field fuse.js searches (title, summary, labels), and each field's length norm
// as fuse.js computes it, round(1000 / √tokens) / 1000, tokens being runs of non-space.
import type { Migration } from '../migrator';

const NORM = (column: string) =>
  `round(1000.0 / sqrt(greatest(1, coalesce(array_length(regexp_split_to_array(btrim(${column}), '\\s+'), 1), 1)))) / 1000.0`;

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  for (const field of ['title', 'summary', 'labels']) {
    await q(`ALTER TABLE library_entries ADD COLUMN ${field}_tsv tsvector GENERATED ALWAYS AS (to_tsvector('english', coalesce(${field}, ''))) STORED`);
    await q(`ALTER TABLE library_entries ADD COLUMN ${field}_norm double precision GENERATED ALWAYS AS (${NORM(`coalesce(${field}, '')`)}) STORED`);
  }
}

export async function down({ context }: Migration): Promise<void> {
  for (const field of ['title', 'summary', 'labels']) {
    await context.sequelize.query(`ALTER TABLE library_entries DROP COLUMN IF EXISTS ${field}_norm`);
    await context.sequelize.query(`ALTER TABLE library_entries DROP COLUMN IF EXISTS ${field}_tsv`);
  }
}
