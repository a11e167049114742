// A planned bee-relevant spray on one or more blocks of a farm.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Organization } from './organization.model.js';
import type { Block } from './block.model.js';
import type { SprayPlanBlock } from './spray-plan-block.model.js';
import type { SprayState } from '../../../../shared/schemas/sprays.js';

type Range = [{ value: Date; inclusive: boolean }, { value: Date; inclusive: boolean }];

export class SprayPlan extends Model<InferAttributes<SprayPlan>, InferCreationAttributes<SprayPlan>> {
  declare id: CreationOptional<string>;
  declare farmId: string;
  declare state: CreationOptional<SprayState>;
  declare plannedWindow: Range;
  declare appliedAt: Date | null;
  declare exposureWindow: Range;
  declare productName: string;
  declare epaRegNo: string | null;
  declare activeIngredients: string[];
  declare ld50UgPerBee: number | null;
  declare rt25Hours: number | null;
  declare targetPest: string | null;
  declare applicatorName: string | null;
  declare notes: string | null;
  declare noticedAt: Date;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare farm?: NonAttribute<Organization>;
  declare blockLinks?: NonAttribute<SprayPlanBlock[]>;
  declare blocks?: NonAttribute<Block[]>;
}

export function defineSprayPlan(sequelize: Sequelize): typeof SprayPlan {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends SprayPlan {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      farmId: { type: DataTypes.UUID, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'planned' },
      plannedWindow: { type: DataTypes.RANGE(DataTypes.DATE), allowNull: false },
      appliedAt: { type: DataTypes.DATE, allowNull: true },
      exposureWindow: { type: DataTypes.RANGE(DataTypes.DATE), allowNull: false },
      productName: { type: DataTypes.TEXT, allowNull: false },
      epaRegNo: { type: DataTypes.TEXT, allowNull: true },
      activeIngredients: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      ld50UgPerBee: { type: DataTypes.DOUBLE, allowNull: true },
      rt25Hours: { type: DataTypes.DOUBLE, allowNull: true },
      targetPest: { type: DataTypes.TEXT, allowNull: true },
      applicatorName: { type: DataTypes.TEXT, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      noticedAt: { type: DataTypes.DATE, allowNull: false },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'SprayPlan', tableName: 'spray_plans' },
  );
  return Bound;
}
