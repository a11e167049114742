// The last invoice or credit-note number taken by an apiary business (gapless series).
// The number itself is taken in SQL (invoices.queries.ts) under a row lock.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class InvoiceNumberCounter extends Model<InferAttributes<InvoiceNumberCounter>, InferCreationAttributes<InvoiceNumberCounter>> {
  declare apiaryId: string;
  declare series: 'invoice' | 'credit-note';
  declare lastNumber: CreationOptional<number>;
}

export function defineInvoiceNumberCounter(sequelize: Sequelize): typeof InvoiceNumberCounter {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends InvoiceNumberCounter {}
  Bound.init(
    {
      apiaryId: { type: DataTypes.UUID, primaryKey: true },
      series: { type: DataTypes.TEXT, primaryKey: true },
      lastNumber: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    },
    { sequelize, modelName: 'InvoiceNumberCounter', tableName: 'invoice_number_counters', timestamps: false },
  );
  return Bound;
}
