// Where on a block a request's colonies are set down: a point, how many, and the access
// notes the crew needs (the gate code is shown once the agreement is confirmed).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Block } from './block.model.js';
import type { Placement } from './placement.model.js';
import type { HiveRequest } from './hive-request.model.js';
import type { GeoPoint } from '../../../../shared/schemas/common.js';

export class DropSite extends Model<InferAttributes<DropSite>, InferCreationAttributes<DropSite>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare blockId: string;
  declare name: string;
  declare location: GeoPoint;
  declare coloniesPlanned: number;
  declare accessNotes: string | null;
  declare vehicleAccess: string | null;
  declare gateCode: string | null;
  declare waterSource: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare block?: NonAttribute<Block>;
  declare request?: NonAttribute<HiveRequest>;
  declare placements?: NonAttribute<Placement[]>;
}

export function defineDropSite(sequelize: Sequelize): typeof DropSite {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends DropSite {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      requestId: { type: DataTypes.UUID, allowNull: false },
      blockId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      location: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: false },
      coloniesPlanned: { type: DataTypes.INTEGER, allowNull: false },
      accessNotes: { type: DataTypes.TEXT, allowNull: true },
      vehicleAccess: { type: DataTypes.TEXT, allowNull: true },
      gateCode: { type: DataTypes.TEXT, allowNull: true },
      waterSource: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'DropSite', tableName: 'drop_sites' },
  );
  return Bound;
}
