// Every association between models, in one place, declared on one app's registry.
// Features add theirs here.
import type { Models } from './models/index.js';

export function associateModels(m: Models) {
  m.Organization.hasMany(m.User, { foreignKey: 'organizationId', as: 'members' });
  m.User.belongsTo(m.Organization, { foreignKey: 'organizationId', as: 'organization' });
  m.Invitation.belongsTo(m.Organization, { foreignKey: 'organizationId', as: 'organization' });
}
