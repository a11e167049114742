// A payment against an invoice: online (its state set only by verified webhooks) or
// recorded by the beekeeper (cheque, bank transfer).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Payment extends Model<InferAttributes<Payment>, InferCreationAttributes<Payment>> {
  declare id: CreationOptional<string>;
  declare invoiceId: string;
  declare method: 'online' | 'cheque' | 'bank-transfer';
  declare state: 'pending' | 'succeeded' | 'failed';
  declare amountCents: number;
  declare currency: string;
  declare providerPaymentId: string | null;
  declare failureMessage: string | null;
  declare reference: string | null;
  declare receivedAt: Date | null;
  declare recordedBy: string | null;
  /** How much of it went beyond what was owed when it arrived (to be refunded). */
  declare overpaidCents: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function definePayment(sequelize: Sequelize): typeof Payment {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Payment {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      invoiceId: { type: DataTypes.UUID, allowNull: false },
      method: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false },
      amountCents: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.CHAR(3), allowNull: false },
      providerPaymentId: { type: DataTypes.TEXT, allowNull: true },
      failureMessage: { type: DataTypes.TEXT, allowNull: true },
      reference: { type: DataTypes.TEXT, allowNull: true },
      receivedAt: { type: DataTypes.DATE, allowNull: true },
      recordedBy: { type: DataTypes.UUID, allowNull: true },
      overpaidCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Payment', tableName: 'payments' },
  );
  return Bound;
}
