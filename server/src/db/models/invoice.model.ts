// An invoice drafted from an agreement: its priced totals and lifecycle (draft, issued, void).
// What a person sees as partly paid, paid or overdue follows from payments and the date.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Invoice extends Model<InferAttributes<Invoice>, InferCreationAttributes<Invoice>> {
  declare id: CreationOptional<string>;
  declare agreementId: string;
  declare apiaryId: string;
  declare farmId: string;
  declare lifecycle: CreationOptional<'draft' | 'issued' | 'void'>;
  declare number: number | null;
  declare currency: string;
  declare timeZone: string;
  declare extraMoves: number;
  declare subtotalCents: number;
  declare taxRateBp: number;
  declare taxCents: number;
  declare totalCents: number;
  declare depositCents: number;
  declare depositDueOn: string | null;
  declare balanceDueOn: string | null;
  declare lateInterestBpPerMonth: number;
  declare reminderIntervalDays: number;
  declare notes: string | null;
  declare issuedAt: Date | null;
  declare issuedBy: string | null;
  declare voidedAt: Date | null;
  declare voidReason: string | null;
  declare createdBy: string | null;
  /** The one checkout session still open at the payments service (a new one expires it). */
  declare openCheckoutSessionId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineInvoice(sequelize: Sequelize): typeof Invoice {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Invoice {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      agreementId: { type: DataTypes.UUID, allowNull: false },
      apiaryId: { type: DataTypes.UUID, allowNull: false },
      farmId: { type: DataTypes.UUID, allowNull: false },
      lifecycle: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
      number: { type: DataTypes.INTEGER, allowNull: true },
      currency: { type: DataTypes.CHAR(3), allowNull: false },
      timeZone: { type: DataTypes.TEXT, allowNull: false },
      extraMoves: { type: DataTypes.INTEGER, allowNull: false },
      subtotalCents: { type: DataTypes.INTEGER, allowNull: false },
      taxRateBp: { type: DataTypes.INTEGER, allowNull: false },
      taxCents: { type: DataTypes.INTEGER, allowNull: false },
      totalCents: { type: DataTypes.INTEGER, allowNull: false },
      depositCents: { type: DataTypes.INTEGER, allowNull: false },
      depositDueOn: { type: DataTypes.DATEONLY, allowNull: true },
      balanceDueOn: { type: DataTypes.DATEONLY, allowNull: true },
      lateInterestBpPerMonth: { type: DataTypes.INTEGER, allowNull: false },
      reminderIntervalDays: { type: DataTypes.INTEGER, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      issuedAt: { type: DataTypes.DATE, allowNull: true },
      issuedBy: { type: DataTypes.UUID, allowNull: true },
      voidedAt: { type: DataTypes.DATE, allowNull: true },
      voidReason: { type: DataTypes.TEXT, allowNull: true },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      openCheckoutSessionId: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Invoice', tableName: 'invoices' },
  );
  return Bound;
}
