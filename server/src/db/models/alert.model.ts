// A conflict alert: one spray plan against one affected apiary business (or the bloom alone).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Organization } from './organization.model.js';
import type { SprayPlan } from './spray-plan.model.js';
import type { AlertState, AlertFinding } from '../../../../shared/schemas/alerts.js';
import type { ConflictGrade } from '../../../../shared/domain/conflict-grading.js';

export class Alert extends Model<InferAttributes<Alert>, InferCreationAttributes<Alert>> {
  declare id: CreationOptional<string>;
  declare sprayPlanId: string;
  declare farmId: string;
  declare apiaryId: string | null;
  declare state: CreationOptional<AlertState>;
  declare grade: ConflictGrade;
  declare grades: ConflictGrade[];
  declare reasons: string[];
  declare findings: AlertFinding;
  declare revision: CreationOptional<string>;
  declare raisedAt: Date;
  declare resolvedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare farm?: NonAttribute<Organization>;
  declare apiary?: NonAttribute<Organization | null>;
  declare spray?: NonAttribute<SprayPlan>;
}

export function defineAlert(sequelize: Sequelize): typeof Alert {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Alert {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      sprayPlanId: { type: DataTypes.UUID, allowNull: false },
      farmId: { type: DataTypes.UUID, allowNull: false },
      apiaryId: { type: DataTypes.UUID, allowNull: true },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'raised' },
      grade: { type: DataTypes.TEXT, allowNull: false },
      grades: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      reasons: { type: DataTypes.JSONB, allowNull: false },
      findings: { type: DataTypes.JSONB, allowNull: false },
      revision: { type: DataTypes.BIGINT },
      raisedAt: { type: DataTypes.DATE, allowNull: false },
      resolvedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Alert', tableName: 'alerts' },
  );
  return Bound;
}
