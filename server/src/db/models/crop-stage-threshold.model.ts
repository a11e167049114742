// A crop stage's degree-day range (°F, as published): the platform's defaults (farmId
// null) or a farm's own, per crop and optionally variety.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { DegreeDayMethod } from '../../../../shared/domain/degree-days.js';

export class CropStageThreshold extends Model<InferAttributes<CropStageThreshold>, InferCreationAttributes<CropStageThreshold>> {
  declare id: CreationOptional<string>;
  declare farmId: string | null;
  declare crop: string;
  declare variety: string | null;
  declare stage: string;
  declare label: string;
  declare sortOrder: number;
  declare baseF: number;
  declare upperF: number | null;
  declare method: DegreeDayMethod;
  declare startMonthDay: string;
  declare ddLowF: number;
  declare ddHighF: number;
  declare source: string;
  declare updatedBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineCropStageThreshold(sequelize: Sequelize): typeof CropStageThreshold {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends CropStageThreshold {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      farmId: { type: DataTypes.UUID, allowNull: true },
      crop: { type: DataTypes.TEXT, allowNull: false },
      variety: { type: DataTypes.TEXT, allowNull: true },
      stage: { type: DataTypes.TEXT, allowNull: false },
      label: { type: DataTypes.TEXT, allowNull: false },
      sortOrder: { type: DataTypes.INTEGER, allowNull: false },
      baseF: { type: DataTypes.DOUBLE, allowNull: false, field: 'base_f' },
      upperF: { type: DataTypes.DOUBLE, allowNull: true, field: 'upper_f' },
      method: { type: DataTypes.TEXT, allowNull: false },
      startMonthDay: { type: DataTypes.CHAR(5), allowNull: false },
      ddLowF: { type: DataTypes.DOUBLE, allowNull: false, field: 'dd_low_f' },
      ddHighF: { type: DataTypes.DOUBLE, allowNull: false, field: 'dd_high_f' },
      source: { type: DataTypes.TEXT, allowNull: false },
      updatedBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'CropStageThreshold', tableName: 'crop_stage_thresholds', underscored: true },
  );
  return Bound;
}
