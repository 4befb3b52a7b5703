// The Field Library narrows on what fuse.js ranks on: title, summary and the vocabulary labels
// (stage, symptoms, cause, remedy) in a small tsvector of their own, `search_head`. Ranking the
// matches of a common word over this short vector is far cheaper than over the whole body, whose
// large vector PostgreSQL keeps compressed out of line. `labels` is written by the app (the
// labels live in server/shared/vocabulary.ts); guides reload with it because their content hash
// is cleared here, and notes are refreshed by the start-up catch-up (field-notes.ts).
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`ALTER TABLE library_entries ADD COLUMN labels text NOT NULL DEFAULT ''`);
  await q(`
    ALTER TABLE library_entries ADD COLUMN search_head tsvector GENERATED ALWAYS AS (
      setweight(to_tsvector('english', coalesce(title, '')), 'A') ||
      setweight(to_tsvector('english', coalesce(summary, '')), 'B') ||
      setweight(to_tsvector('english', labels), 'C')) STORED`);
  await q(`CREATE INDEX library_entries_search_head_idx ON library_entries USING gin (search_head)`);
  await q(`UPDATE library_entries SET content_hash = NULL WHERE kind = 'guide'`);
}

export async function down({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`DROP INDEX IF EXISTS library_entries_search_head_idx`);
  await q(`ALTER TABLE library_entries DROP COLUMN IF EXISTS search_head`);
  await q(`ALTER TABLE library_entries DROP COLUMN IF EXISTS labels`);
}
