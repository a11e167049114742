// A credit note: the only way to correct an issued invoice. Numbered per apiary business.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class CreditNote extends Model<InferAttributes<CreditNote>, InferCreationAttributes<CreditNote>> {
  declare id: CreationOptional<string>;
  declare invoiceId: string;
  declare apiaryId: string;
  declare number: number;
  declare amountCents: number;
  declare reason: string;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function defineCreditNote(sequelize: Sequelize): typeof CreditNote {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends CreditNote {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      invoiceId: { type: DataTypes.UUID, allowNull: false },
      apiaryId: { type: DataTypes.UUID, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      amountCents: { type: DataTypes.INTEGER, allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'CreditNote', tableName: 'credit_notes', updatedAt: false },
  );
  return Bound;
}
