// A request key sent by a client (the phone's outbox, the spray form) and the first answer
// given to it, so a repeat of the same request gets that answer back and changes nothing
// (middleware/idempotency-key.ts).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class IdempotencyKey extends Model<InferAttributes<IdempotencyKey>, InferCreationAttributes<IdempotencyKey>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare key: string;
  declare method: string;
  declare path: string;
  declare requestHash: string;
  declare responseStatus: CreationOptional<number | null>;
  declare responseBody: CreationOptional<object | null>;
  declare startedAt: CreationOptional<Date>;
  declare completedAt: CreationOptional<Date | null>;
}

export function defineIdempotencyKey(sequelize: Sequelize): typeof IdempotencyKey {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends IdempotencyKey {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      userId: { type: DataTypes.UUID, allowNull: false },
      key: { type: DataTypes.TEXT, allowNull: false },
      method: { type: DataTypes.TEXT, allowNull: false },
      path: { type: DataTypes.TEXT, allowNull: false },
      requestHash: { type: DataTypes.TEXT, allowNull: false },
      responseStatus: { type: DataTypes.INTEGER, allowNull: true },
      responseBody: { type: DataTypes.JSONB, allowNull: true },
      startedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      completedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, modelName: 'IdempotencyKey', tableName: 'idempotency_keys', underscored: true, timestamps: false },
  );
  return Bound;
}
