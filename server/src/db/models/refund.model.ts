// A refund of an online payment, kept by the payment service's refund id.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Refund extends Model<InferAttributes<Refund>, InferCreationAttributes<Refund>> {
  declare id: CreationOptional<string>;
  declare invoiceId: string;
  declare providerRefundId: string;
  declare providerPaymentId: string;
  declare state: 'pending' | 'succeeded' | 'failed';
  declare amountCents: number;
  declare reason: string | null;
  declare requestedBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineRefund(sequelize: Sequelize): typeof Refund {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Refund {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      invoiceId: { type: DataTypes.UUID, allowNull: false },
      providerRefundId: { type: DataTypes.TEXT, allowNull: false },
      providerPaymentId: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false },
      amountCents: { type: DataTypes.INTEGER, allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: true },
      requestedBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Refund', tableName: 'refunds' },
  );
  return Bound;
}
