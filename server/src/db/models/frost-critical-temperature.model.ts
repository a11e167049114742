// A crop stage's critical bud temperatures (°F as published: 10% and 90% kill).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class FrostCriticalTemperature extends Model<InferAttributes<FrostCriticalTemperature>, InferCreationAttributes<FrostCriticalTemperature>> {
  declare id: CreationOptional<string>;
  declare crop: string;
  declare stageLabel: string;
  declare stage: string | null;
  declare sortOrder: number;
  declare kill10F: number;
  declare kill90F: number;
  declare source: string;
  declare updatedBy: string | null;
  declare updatedAt: CreationOptional<Date>;
}

export function defineFrostCriticalTemperature(sequelize: Sequelize): typeof FrostCriticalTemperature {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends FrostCriticalTemperature {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      crop: { type: DataTypes.TEXT, allowNull: false },
      stageLabel: { type: DataTypes.TEXT, allowNull: false },
      stage: { type: DataTypes.TEXT, allowNull: true },
      sortOrder: { type: DataTypes.INTEGER, allowNull: false },
      kill10F: { type: DataTypes.DOUBLE, allowNull: false, field: 'kill10_f' },
      kill90F: { type: DataTypes.DOUBLE, allowNull: false, field: 'kill90_f' },
      source: { type: DataTypes.TEXT, allowNull: false },
      updatedBy: { type: DataTypes.UUID, allowNull: true },
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'FrostCriticalTemperature', tableName: 'frost_critical_temperatures', underscored: true, createdAt: false },
  );
  return Bound;
}
