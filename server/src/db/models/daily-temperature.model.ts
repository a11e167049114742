// One station's minimum and maximum temperature of a day, in °C.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class DailyTemperature extends Model<InferAttributes<DailyTemperature>, InferCreationAttributes<DailyTemperature>> {
  declare stationId: string;
  declare day: string;
  declare tminC: number;
  declare tmaxC: number;
  declare source: 'upload' | 'manual';
  declare enteredBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineDailyTemperature(sequelize: Sequelize): typeof DailyTemperature {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends DailyTemperature {}
  Bound.init(
    {
      stationId: { type: DataTypes.UUID, primaryKey: true },
      day: { type: DataTypes.DATEONLY, primaryKey: true },
      tminC: { type: DataTypes.DOUBLE, allowNull: false, field: 'tmin_c' },
      tmaxC: { type: DataTypes.DOUBLE, allowNull: false, field: 'tmax_c' },
      source: { type: DataTypes.TEXT, allowNull: false },
      enteredBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'DailyTemperature', tableName: 'daily_temperatures', underscored: true },
  );
  return Bound;
}
