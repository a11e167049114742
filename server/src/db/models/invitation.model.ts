// An invitation to join an organization with a role; the e-mailed link carries a token
// of which only the hash is kept.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { MemberRole } from '../../../../shared/roles.js';
import type { Organization } from './organization.model.js';
import type { User } from './user.model.js';

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare email: string;
  declare role: Exclude<MemberRole, 'admin'>;
  declare invitedBy: string | null;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organization?: NonAttribute<Organization>;
  declare inviter?: NonAttribute<User | null>;
}

export function defineInvitation(sequelize: Sequelize): typeof Invitation {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Invitation {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      organizationId: { type: DataTypes.UUID, allowNull: false },
      email: { type: DataTypes.TEXT, allowNull: false },
      role: { type: DataTypes.TEXT, allowNull: false },
      invitedBy: { type: DataTypes.UUID, allowNull: true },
      tokenHash: { type: DataTypes.TEXT, allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Invitation', tableName: 'invitations' },
  );
  return Bound;
}
