// A block a spray plan covers.
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Block } from './block.model.js';

export class SprayPlanBlock extends Model<InferAttributes<SprayPlanBlock>, InferCreationAttributes<SprayPlanBlock>> {
  declare sprayPlanId: string;
  declare blockId: string;
  declare block?: NonAttribute<Block>;
}

export function defineSprayPlanBlock(sequelize: Sequelize): typeof SprayPlanBlock {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends SprayPlanBlock {}
  Bound.init(
    {
      sprayPlanId: { type: DataTypes.UUID, primaryKey: true },
      blockId: { type: DataTypes.UUID, primaryKey: true },
    },
    { sequelize, modelName: 'SprayPlanBlock', tableName: 'spray_plan_blocks', timestamps: false },
  );
  return Bound;
}
