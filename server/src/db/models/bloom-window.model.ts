// One revision of a block's published bloom window; every revision is kept.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Block } from './block.model.js';
import type { User } from './user.model.js';

export class BloomWindow extends Model<InferAttributes<BloomWindow>, InferCreationAttributes<BloomWindow>> {
  declare id: CreationOptional<string>;
  declare blockId: string;
  declare season: number;
  declare bloomStart: string;
  declare fullBloom: string | null;
  declare petalFall: string;
  declare confidenceNote: string | null;
  declare revisedBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare block?: NonAttribute<Block>;
  declare reviser?: NonAttribute<User | null>;
}

export function defineBloomWindow(sequelize: Sequelize): typeof BloomWindow {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends BloomWindow {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      blockId: { type: DataTypes.UUID, allowNull: false },
      season: { type: DataTypes.INTEGER, allowNull: false },
      bloomStart: { type: DataTypes.DATEONLY, allowNull: false },
      fullBloom: { type: DataTypes.DATEONLY, allowNull: true },
      petalFall: { type: DataTypes.DATEONLY, allowNull: false },
      confidenceNote: { type: DataTypes.TEXT, allowNull: true },
      revisedBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'BloomWindow', tableName: 'bloom_windows', underscored: true, updatedAt: false },
  );
  return Bound;
}
