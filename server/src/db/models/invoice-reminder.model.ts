// An overdue reminder sent for an invoice: the log that keeps reminders to one per
// agreed interval.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class InvoiceReminder extends Model<InferAttributes<InvoiceReminder>, InferCreationAttributes<InvoiceReminder>> {
  declare id: CreationOptional<string>;
  declare invoiceId: string;
  declare sentAt: Date;
  declare sentTo: string;
  declare overdueCents: number;
}

export function defineInvoiceReminder(sequelize: Sequelize): typeof InvoiceReminder {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends InvoiceReminder {}
  Bound.init(
    {
      // bigserial: pg answers it as a string.
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      invoiceId: { type: DataTypes.UUID, allowNull: false },
      sentAt: { type: DataTypes.DATE, allowNull: false },
      sentTo: { type: DataTypes.TEXT, allowNull: false },
      overdueCents: { type: DataTypes.INTEGER, allowNull: false },
    },
    { sequelize, modelName: 'InvoiceReminder', tableName: 'invoice_reminders', timestamps: false },
  );
  return Bound;
}
