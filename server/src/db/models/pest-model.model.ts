// A pest development model kept as sourced data (thresholds, method, stages in degree days).
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class PestModel extends Model<InferAttributes<PestModel>, InferCreationAttributes<PestModel>> {
  declare id: string;
  declare name: string;
  declare lowerThresholdF: number;
  declare upperThresholdF: number;
  declare method: 'single-sine';
  declare cutoff: 'horizontal';
  declare biofixRule: string;
  declare stages: Array<{ name: string; degreeDaysF: number }>;
  declare source: string;
}

export function definePestModel(sequelize: Sequelize): typeof PestModel {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends PestModel {}
  Bound.init(
    {
      id: { type: DataTypes.TEXT, primaryKey: true },
      name: { type: DataTypes.TEXT, allowNull: false },
      lowerThresholdF: { type: DataTypes.DOUBLE, allowNull: false },
      upperThresholdF: { type: DataTypes.DOUBLE, allowNull: false },
      method: { type: DataTypes.TEXT, allowNull: false },
      cutoff: { type: DataTypes.TEXT, allowNull: false },
      biofixRule: { type: DataTypes.TEXT, allowNull: false },
      stages: { type: DataTypes.JSONB, allowNull: false },
      source: { type: DataTypes.TEXT, allowNull: false },
    },
    { sequelize, modelName: 'PestModel', tableName: 'pest_models', timestamps: false },
  );
  return Bound;
}
