// A farm's weather station: where daily temperatures and forecast lows are recorded.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { GeoPoint } from '../../../../shared/schemas/common.js';

export class WeatherStation extends Model<InferAttributes<WeatherStation>, InferCreationAttributes<WeatherStation>> {
  declare id: CreationOptional<string>;
  declare farmId: string;
  declare name: string;
  declare location: GeoPoint;
  declare timeZone: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineWeatherStation(sequelize: Sequelize): typeof WeatherStation {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends WeatherStation {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      farmId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      location: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: false },
      timeZone: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize, modelName: 'WeatherStation', tableName: 'weather_stations', underscored: true,
      // WeatherStation.scope({ method: ['ofFarm', farmId] }): only that farm's stations.
      scopes: { ofFarm: (farmId: string) => ({ where: { farmId } }) },
    },
  );
  return Bound;
}
