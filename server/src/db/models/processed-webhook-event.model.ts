// A payments-service event already acted on, written in the same transaction as its
// effect, so a redelivered event changes nothing.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class ProcessedWebhookEvent extends Model<InferAttributes<ProcessedWebhookEvent>, InferCreationAttributes<ProcessedWebhookEvent>> {
  declare eventId: string;
  declare type: string;
  declare receivedAt: CreationOptional<Date>;
}

export function defineProcessedWebhookEvent(sequelize: Sequelize): typeof ProcessedWebhookEvent {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends ProcessedWebhookEvent {}
  Bound.init(
    {
      eventId: { type: DataTypes.TEXT, primaryKey: true },
      type: { type: DataTypes.TEXT, allowNull: false },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, modelName: 'ProcessedWebhookEvent', tableName: 'processed_webhook_events', timestamps: false },
  );
  return Bound;
}
