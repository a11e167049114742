// A forecast minimum temperature (°C) for a station and day, for the frost warning.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class ForecastLow extends Model<InferAttributes<ForecastLow>, InferCreationAttributes<ForecastLow>> {
  declare stationId: string;
  declare day: string;
  declare lowC: number;
  declare enteredBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineForecastLow(sequelize: Sequelize): typeof ForecastLow {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends ForecastLow {}
  Bound.init(
    {
      stationId: { type: DataTypes.UUID, primaryKey: true },
      day: { type: DataTypes.DATEONLY, primaryKey: true },
      lowC: { type: DataTypes.DOUBLE, allowNull: false, field: 'low_c' },
      enteredBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'ForecastLow', tableName: 'forecast_lows', underscored: true },
  );
  return Bound;
}
