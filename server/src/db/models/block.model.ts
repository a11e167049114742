// A planted area of one crop on a farm. Outline and location are PostGIS geometry (SRID
// 4326); area_m2 comes from the outline (geodesic) or the entered acreage.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { GeoPoint, GeoPolygon } from '../../../../shared/schemas/common.js';
import type { Organization } from './organization.model.js';
import type { WeatherStation } from './weather-station.model.js';

export class Block extends Model<InferAttributes<Block>, InferCreationAttributes<Block>> {
  declare id: CreationOptional<string>;
  declare farmId: string;
  declare name: string;
  declare crop: string;
  declare variety: string | null;
  declare pollinizerVariety: string | null;
  declare yearPlanted: number | null;
  declare treesPerAcre: number | null;
  declare notes: string | null;
  declare outline: GeoPolygon | null;
  declare location: GeoPoint | null;
  declare enteredAcres: number | null;
  declare areaM2: number;
  declare coloniesPerAcre: number;
  declare weatherStationId: string | null;
  declare degreeDayStart: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare farm?: NonAttribute<Organization>;
  declare weatherStation?: NonAttribute<WeatherStation | null>;
}

export function defineBlock(sequelize: Sequelize): typeof Block {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Block {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      farmId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      crop: { type: DataTypes.TEXT, allowNull: false },
      variety: { type: DataTypes.TEXT, allowNull: true },
      pollinizerVariety: { type: DataTypes.TEXT, allowNull: true },
      yearPlanted: { type: DataTypes.INTEGER, allowNull: true },
      treesPerAcre: { type: DataTypes.DOUBLE, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      outline: { type: DataTypes.GEOMETRY('POLYGON', 4326), allowNull: true },
      location: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: true },
      enteredAcres: { type: DataTypes.DOUBLE, allowNull: true },
      areaM2: { type: DataTypes.DOUBLE, allowNull: false, field: 'area_m2' },
      coloniesPerAcre: { type: DataTypes.DOUBLE, allowNull: false },
      weatherStationId: { type: DataTypes.UUID, allowNull: true },
      degreeDayStart: { type: DataTypes.DATEONLY, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize, modelName: 'Block', tableName: 'blocks', underscored: true,
      // Block.scope({ method: ['ofFarm', farmId] }): only that farm's blocks (another farm's are "not found").
      scopes: { ofFarm: (farmId: string) => ({ where: { farmId } }) },
    },
  );
  return Bound;
}
