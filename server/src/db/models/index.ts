// Initialises every model on one Sequelize instance, then their associations.
// Features add their init function to the list.
import type { Sequelize } from 'sequelize';
import { initOrganization } from './organization.model.js';
import { initUser } from './user.model.js';
import { associateModels } from '../associations.js';

const modelInitializers: Array<(sequelize: Sequelize) => void> = [initOrganization, initUser];

export function initModels(sequelize: Sequelize) {
  for (const init of modelInitializers) init(sequelize);
  associateModels();
}
