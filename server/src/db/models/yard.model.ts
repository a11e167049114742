// An apiary business's yard: a home location that distances to requests are measured from.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { GeoPoint } from '../../../../shared/schemas/common.js';

export class Yard extends Model<InferAttributes<Yard>, InferCreationAttributes<Yard>> {
  declare id: CreationOptional<string>;
  declare apiaryId: string;
  declare name: string;
  declare location: GeoPoint;
  declare colonies: number | null;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineYard(sequelize: Sequelize): typeof Yard {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Yard {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      apiaryId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      location: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: false },
      colonies: { type: DataTypes.INTEGER, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize, modelName: 'Yard', tableName: 'yards',
      scopes: { ofApiary: (apiaryId: string) => ({ where: { apiaryId } }) },
    },
  );
  return Bound;
}
