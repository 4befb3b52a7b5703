// Every Sequelize model is initialised here, once per process, before the first query.
import type { Sequelize } from 'sequelize';
import { initUserModel } from '../modules/users/users.model';

let done = false;
export function initModels(sequelize: Sequelize): void {
  if (done) return;
  done = true;
  initUserModel(sequelize);
}
