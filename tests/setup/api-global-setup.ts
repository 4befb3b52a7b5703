// The API project's database: migrated from empty once per run (CI proves every migration
// runs on an empty database). Test files then make their own data with the factories.
import { migrate } from '../../server/src/db/migrator';
import { createSequelize } from '../../server/src/db/sequelize';

export default async function setup(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests with `npm test`.');
  const sequelize = createSequelize(url);
  try {
    await sequelize.query('DROP SCHEMA public CASCADE; CREATE SCHEMA public;');
    await migrate(sequelize);
  } finally {
    await sequelize.close();
  }
}
