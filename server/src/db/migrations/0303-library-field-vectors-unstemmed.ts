// The per-field vectors of 0302 hold words as written ('simple'), not stemmed: fuse.js counts
// "bubbles" as only a near match for "bubbling", so the ranking that stands in for it must not
// treat them as the same word. Variants reach a field as readings with their own fuse.js score.
import type { Migration } from '../migrator';

const FIELDS = ['title', 'summary', 'labels'] as const;

export async function up({ context }: Migration): Promise<void> {
  for (const field of FIELDS) {
    await context.sequelize.query(`ALTER TABLE library_entries DROP COLUMN ${field}_tsv`);
    await context.sequelize.query(
      `ALTER TABLE library_entries ADD COLUMN ${field}_tsv tsvector GENERATED ALWAYS AS (to_tsvector('simple', coalesce(${field}, ''))) STORED`,
    );
  }
}

export async function down({ context }: Migration): Promise<void> {
  for (const field of FIELDS) {
    await context.sequelize.query(`ALTER TABLE library_entries DROP COLUMN ${field}_tsv`);
    await context.sequelize.query(
      `ALTER TABLE library_entries ADD COLUMN ${field}_tsv tsvector GENERATED ALWAYS AS (to_tsvector('english', coalesce(${field}, ''))) STORED`,
    );
  }
}
