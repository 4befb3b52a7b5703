// A steward's hold on a case's field note: taken out of the Field Library, with the reason, and
// kept out (a mentor's re-publish or the grower's consent given again does not bring it back)
// until a steward puts it back.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(`
    ALTER TABLE cases
      ADD COLUMN IF NOT EXISTS library_hold_reason text,
      ADD COLUMN IF NOT EXISTS library_hold_by integer REFERENCES users(id),
      ADD COLUMN IF NOT EXISTS library_hold_at timestamptz
  `);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`
    ALTER TABLE cases DROP COLUMN IF EXISTS library_hold_reason, DROP COLUMN IF EXISTS library_hold_by, DROP COLUMN IF EXISTS library_hold_at
  `);
}
