// One priced line of an invoice (colonies at full rate, below minimum, extra moves).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { PricedLineKind } from '../../../../shared/domain/invoice-pricing.js';

export class InvoiceLine extends Model<InferAttributes<InvoiceLine>, InferCreationAttributes<InvoiceLine>> {
  declare id: CreationOptional<string>;
  declare invoiceId: string;
  declare position: number;
  declare kind: PricedLineKind;
  declare placementId: string | null;
  declare description: string;
  declare quantity: number;
  declare unitCents: number;
  declare amountCents: number;
}

export function defineInvoiceLine(sequelize: Sequelize): typeof InvoiceLine {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends InvoiceLine {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      invoiceId: { type: DataTypes.UUID, allowNull: false },
      position: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      placementId: { type: DataTypes.UUID, allowNull: true },
      description: { type: DataTypes.TEXT, allowNull: false },
      quantity: { type: DataTypes.INTEGER, allowNull: false },
      unitCents: { type: DataTypes.INTEGER, allowNull: false },
      amountCents: { type: DataTypes.INTEGER, allowNull: false },
    },
    { sequelize, modelName: 'InvoiceLine', tableName: 'invoice_lines', timestamps: false },
  );
  return Bound;
}
