// One pheromone trap check on a block: moths caught on a day.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class PestTrapCount extends Model<InferAttributes<PestTrapCount>, InferCreationAttributes<PestTrapCount>> {
  declare id: CreationOptional<string>;
  declare blockId: string;
  declare pestModelId: string;
  declare checkedOn: string;
  declare moths: number;
  declare recordedBy: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function definePestTrapCount(sequelize: Sequelize): typeof PestTrapCount {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends PestTrapCount {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      blockId: { type: DataTypes.UUID, allowNull: false },
      pestModelId: { type: DataTypes.TEXT, allowNull: false },
      checkedOn: { type: DataTypes.DATEONLY, allowNull: false },
      moths: { type: DataTypes.INTEGER, allowNull: false },
      recordedBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'PestTrapCount', tableName: 'pest_trap_counts', updatedAt: false },
  );
  return Bound;
}
