// A block a spray plan covers.
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class SprayPlanBlock extends Model<InferAttributes<SprayPlanBlock>, InferCreationAttributes<SprayPlanBlock>> {
  declare sprayPlanId: string;
  declare blockId: string;
}

export function initSprayPlanBlock(sequelize: Sequelize) {
  SprayPlanBlock.init(
    {
      sprayPlanId: { type: DataTypes.UUID, primaryKey: true },
      blockId: { type: DataTypes.UUID, primaryKey: true },
    },
    { sequelize, tableName: 'spray_plan_blocks', timestamps: false },
  );
}
