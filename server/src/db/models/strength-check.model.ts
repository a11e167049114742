// A strength check of placed colonies: frames of bees (and brood) of each colony opened.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user.model.js';

export class StrengthCheck extends Model<InferAttributes<StrengthCheck>, InferCreationAttributes<StrengthCheck>> {
  declare id: CreationOptional<string>;
  declare placementId: string;
  declare checkedAt: Date;
  declare checkedBy: string | null;
  declare inspectorName: string | null;
  declare coloniesInGroup: number;
  declare framesOfBees: number[];
  declare framesOfBrood: number[] | null;
  declare notes: string | null;
  declare recordedAt: Date | null;
  declare receivedAt: CreationOptional<Date>;
  declare createdAt: CreationOptional<Date>;
  declare checker?: NonAttribute<User | null>;
}

export function defineStrengthCheck(sequelize: Sequelize): typeof StrengthCheck {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends StrengthCheck {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      placementId: { type: DataTypes.UUID, allowNull: false },
      checkedAt: { type: DataTypes.DATE, allowNull: false },
      checkedBy: { type: DataTypes.UUID, allowNull: true },
      inspectorName: { type: DataTypes.TEXT, allowNull: true },
      coloniesInGroup: { type: DataTypes.INTEGER, allowNull: false },
      framesOfBees: { type: DataTypes.ARRAY(DataTypes.DOUBLE), allowNull: false },
      framesOfBrood: { type: DataTypes.ARRAY(DataTypes.DOUBLE), allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      recordedAt: { type: DataTypes.DATE, allowNull: true },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'StrengthCheck', tableName: 'strength_checks', updatedAt: false },
  );
  return Bound;
}
