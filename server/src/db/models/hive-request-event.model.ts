// One line of a hive request's audit trail: who did what, when, with the details.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user.model.js';

export class HiveRequestEvent extends Model<InferAttributes<HiveRequestEvent>, InferCreationAttributes<HiveRequestEvent>> {
  /** bigserial: PostgreSQL's int8 reaches JavaScript as a string. */
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare actorId: string | null;
  declare action: string;
  declare detail: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User | null>;
}

export function defineHiveRequestEvent(sequelize: Sequelize): typeof HiveRequestEvent {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends HiveRequestEvent {}
  Bound.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      requestId: { type: DataTypes.UUID, allowNull: false },
      actorId: { type: DataTypes.UUID, allowNull: true },
      action: { type: DataTypes.TEXT, allowNull: false },
      detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'HiveRequestEvent', tableName: 'hive_request_events', updatedAt: false },
  );
  return Bound;
}
