// The rounds list reads only open cases (a few thousand among many resolved ones) and sorts
// them by the effective urgency, which is computed from urgency and waiting_since. This index
// holds every column the list filters and sorts on, so choosing a page of 50 and counting the
// matches can read the index instead of the table (measured with EXPLAIN on 3,000 open cases
// among 100,000 resolved ones; see cases.repository.ts).
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(`
    CREATE INDEX cases_open_rounds_idx ON cases (status)
      INCLUDE (id, urgency, waiting_since, opened_at, stage, mentor_id, grower_id, symptom_bits)
     WHERE status IN ('awaiting_mentor', 'in_conversation', 'over_to_grower')`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP INDEX IF EXISTS cases_open_rounds_idx`);
}
