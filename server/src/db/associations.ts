// Every association between models, in one place. Features add theirs here.
import { Organization } from './models/organization.model.js';
import { User } from './models/user.model.js';
import { Invitation } from './models/invitation.model.js';

export function associateModels() {
  Organization.hasMany(User, { foreignKey: 'organizationId', as: 'members' });
  User.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
  Invitation.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
}
