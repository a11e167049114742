// When an organization first saw an alert (drives the bell's count).
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class AlertView extends Model<InferAttributes<AlertView>, InferCreationAttributes<AlertView>> {
  declare alertId: string;
  declare organizationId: string;
  declare seenBy: string | null;
  declare seenAt: Date;
}

export function defineAlertView(sequelize: Sequelize): typeof AlertView {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends AlertView {}
  Bound.init(
    {
      alertId: { type: DataTypes.UUID, primaryKey: true },
      organizationId: { type: DataTypes.UUID, primaryKey: true },
      seenBy: { type: DataTypes.UUID, allowNull: true },
      seenAt: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, modelName: 'AlertView', tableName: 'alert_views', timestamps: false },
  );
  return Bound;
}
