// A farm (grower side) or an apiary business (beekeeper side).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { OrganizationKind } from '../../../../shared/roles.js';

export class Organization extends Model<InferAttributes<Organization>, InferCreationAttributes<Organization>> {
  declare id: CreationOptional<string>;
  declare kind: OrganizationKind;
  declare name: string;
  declare timeZone: CreationOptional<string>;
  declare sprayBufferM: CreationOptional<number>;
  declare billingEmail: string | null;
  declare taxRateBp: CreationOptional<number>;
  declare currency: CreationOptional<string>;
  declare coloniesOwned: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineOrganization(sequelize: Sequelize): typeof Organization {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Organization {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      kind: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      timeZone: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'America/Los_Angeles' },
      sprayBufferM: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1609.344 },
      billingEmail: { type: DataTypes.TEXT, allowNull: true },
      taxRateBp: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'USD' },
      coloniesOwned: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Organization', tableName: 'organizations' },
  );
  return Bound;
}
