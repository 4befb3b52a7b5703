// Closing into the Field Library:
// - cases.redact_terms: words or places the mentor flagged to leave out of the field note;
// - cases.closed_by: who closed the case (its mentor or a steward), for the system line and audit;
// - a trigram index on library titles, for a misspelt word that no known term corrects;
// - an index the remedy track records aggregate over (only cases with a reported outcome).
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`ALTER TABLE cases ADD COLUMN redact_terms text[] NOT NULL DEFAULT '{}'`);
  await q(`ALTER TABLE cases ADD COLUMN closed_by integer REFERENCES users(id) ON DELETE SET NULL`);
  await q(`CREATE INDEX cases_outcome_remedy_idx ON cases (remedy) INCLUDE (outcome, stars) WHERE outcome IS NOT NULL`);
  await q(`CREATE INDEX cases_watching_closed_idx ON cases (closed_at) WHERE status = 'watching'`);
  await q(`CREATE INDEX library_entries_title_trgm_idx ON library_entries USING gin (lower(title) gin_trgm_ops)`);
  await q(`CREATE INDEX library_entries_kind_published_idx ON library_entries (kind, published_at DESC)`);
}

export async function down({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`DROP INDEX IF EXISTS library_entries_kind_published_idx`);
  await q(`DROP INDEX IF EXISTS library_entries_title_trgm_idx`);
  await q(`DROP INDEX IF EXISTS cases_watching_closed_idx`);
  await q(`DROP INDEX IF EXISTS cases_outcome_remedy_idx`);
  await q(`ALTER TABLE cases DROP COLUMN IF EXISTS closed_by`);
  await q(`ALTER TABLE cases DROP COLUMN IF EXISTS redact_terms`);
}
