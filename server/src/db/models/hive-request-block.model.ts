// How many colonies a request asks for on one of its blocks (the request/block join).
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Block } from './block.model.js';

export class HiveRequestBlock extends Model<InferAttributes<HiveRequestBlock>, InferCreationAttributes<HiveRequestBlock>> {
  declare requestId: string;
  declare blockId: string;
  declare colonies: number;
  declare block?: NonAttribute<Block>;
}

export function defineHiveRequestBlock(sequelize: Sequelize): typeof HiveRequestBlock {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends HiveRequestBlock {}
  Bound.init(
    {
      requestId: { type: DataTypes.UUID, primaryKey: true },
      blockId: { type: DataTypes.UUID, primaryKey: true },
      colonies: { type: DataTypes.INTEGER, allowNull: false },
    },
    { sequelize, modelName: 'HiveRequestBlock', tableName: 'hive_request_blocks', timestamps: false },
  );
  return Bound;
}
