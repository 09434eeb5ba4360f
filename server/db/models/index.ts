import type { Sequelize } from 'sequelize';
import { initUser } from './user';

export { User, ROLES, type Role, type PublicUser } from './user';

export function initModels(sequelize: Sequelize) {
  initUser(sequelize);
}
