// Nothing reads search_head (0301) since the head search moved to the words as written (0305);
// keeping it would cost a stemmed vector and a GIN entry per word on every note written.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query('ALTER TABLE library_entries DROP COLUMN IF EXISTS search_head');
}

export async function down({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`
    ALTER TABLE library_entries ADD COLUMN search_head tsvector GENERATED ALWAYS AS (
      setweight(to_tsvector('english', coalesce(title, '')), 'A') ||
      setweight(to_tsvector('english', coalesce(summary, '')), 'B') ||
      setweight(to_tsvector('english', labels), 'C')) STORED`);
  await q('CREATE INDEX library_entries_search_head_idx ON library_entries USING gin (search_head)');
}
