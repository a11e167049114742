// One step in an alert's history: raised, updated, seen, answered, resolved, reopened.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Organization } from './organization.model.js';
import type { User } from './user.model.js';
import type { AlertAction } from '../../../../shared/schemas/alerts.js';

export class AlertEvent extends Model<InferAttributes<AlertEvent>, InferCreationAttributes<AlertEvent>> {
  declare id: CreationOptional<string>;
  declare alertId: string;
  declare action: AlertAction;
  declare actorId: string | null;
  declare organizationId: string | null;
  declare response: string | null;
  declare note: string | null;
  declare detail: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User | null>;
  declare organization?: NonAttribute<Organization | null>;
}

export function defineAlertEvent(sequelize: Sequelize): typeof AlertEvent {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends AlertEvent {}
  Bound.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      alertId: { type: DataTypes.UUID, allowNull: false },
      action: { type: DataTypes.TEXT, allowNull: false },
      actorId: { type: DataTypes.UUID, allowNull: true },
      organizationId: { type: DataTypes.UUID, allowNull: true },
      response: { type: DataTypes.TEXT, allowNull: true },
      note: { type: DataTypes.TEXT, allowNull: true },
      detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'AlertEvent', tableName: 'alert_events', updatedAt: false },
  );
  return Bound;
}
