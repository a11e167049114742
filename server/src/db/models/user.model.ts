// A person who signs in; belongs to one organization with a role (the platform admin to none).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { MemberRole } from '../../../../shared/roles.js';
import type { Organization } from './organization.model.js';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare organizationId: string | null;
  declare email: string;
  declare name: string;
  declare passwordHash: string | null;
  declare role: MemberRole;
  declare units: CreationOptional<'imperial' | 'metric'>;
  declare timeZone: string | null;
  declare calendarToken: string | null;
  declare disabledAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organization?: NonAttribute<Organization | null>;
}

export function defineUser(sequelize: Sequelize): typeof User {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends User {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      organizationId: { type: DataTypes.UUID, allowNull: true },
      email: { type: DataTypes.TEXT, allowNull: false, unique: true },
      name: { type: DataTypes.TEXT, allowNull: false },
      passwordHash: { type: DataTypes.TEXT, allowNull: true },
      role: { type: DataTypes.TEXT, allowNull: false },
      units: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'imperial' },
      timeZone: { type: DataTypes.TEXT, allowNull: true },
      calendarToken: { type: DataTypes.TEXT, allowNull: true, unique: true },
      disabledAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'User', tableName: 'users' },
  );
  return Bound;
}
