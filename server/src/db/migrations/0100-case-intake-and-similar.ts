// Case intake, the rounds list and "batches like this".
// - waiting_since: when the case began waiting for a mentor's reply (NULL while it waits on
//   no one). The rounds list adds the waiting part of the urgency in SQL from it, so the stored
//   `urgency` is the part that does not grow with time and needs no periodic rewrite.
// - terms_indexed: whether a resolved case's words are already counted in search_terms, so
//   indexing it twice does not count its words twice.
// - indexes measured with EXPLAIN (see cases.repository.ts and scripts/bench-similar.ts).
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`ALTER TABLE cases ADD COLUMN waiting_since timestamptz`);
  await q(`ALTER TABLE cases ADD COLUMN terms_indexed boolean NOT NULL DEFAULT false`);
  await q(`UPDATE cases SET waiting_since = coalesce(last_message_at, opened_at) WHERE status IN ('awaiting_mentor', 'in_conversation')`);

  // Rounds: open cases by age (oldest/newest sorts and the age filter) without touching the
  // resolved bulk of the table.
  await q(`CREATE INDEX cases_open_opened_idx ON cases (opened_at) WHERE status IN ('awaiting_mentor', 'in_conversation', 'over_to_grower')`);
  // Batches like this: overlapping symptoms among resolved cases only (the GIN index of 0002
  // covers every case, most of which a similarity query never wants).
  await q(`CREATE INDEX cases_resolved_symptoms_idx ON cases USING gin (symptoms) WHERE status IN ('recovered', 'lost')`);
  // A photo tied to a thread message is looked up by it (and cleared when it goes).
  await q(`CREATE INDEX case_photos_message_idx ON case_photos (message_id) WHERE message_id IS NOT NULL`);
}

export async function down({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`DROP INDEX IF EXISTS case_photos_message_idx`);
  await q(`DROP INDEX IF EXISTS cases_resolved_symptoms_idx`);
  await q(`DROP INDEX IF EXISTS cases_open_opened_idx`);
  await q(`ALTER TABLE cases DROP COLUMN IF EXISTS terms_indexed`);
  await q(`ALTER TABLE cases DROP COLUMN IF EXISTS waiting_since`);
}
