// A change to a signed agreement: proposed by one side, confirmed or rejected by the other.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user.model.js';
import type { AmendmentChanges, AmendmentDto } from '../../../../shared/schemas/agreements.js';

export class AgreementAmendment extends Model<InferAttributes<AgreementAmendment>, InferCreationAttributes<AgreementAmendment>> {
  declare id: CreationOptional<string>;
  declare agreementId: string;
  declare state: CreationOptional<AmendmentDto['state']>;
  declare changes: AmendmentChanges;
  /** The terms before the change (column `previous`; Model has a method of that name). */
  declare previousTerms: CreationOptional<Record<string, unknown>>;
  declare reason: string;
  declare proposedSide: 'farm' | 'apiary';
  declare proposedBy: string | null;
  declare decidedBy: CreationOptional<string | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare versionAfter: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare proposer?: NonAttribute<User | null>;
  declare decider?: NonAttribute<User | null>;
}

export function defineAgreementAmendment(sequelize: Sequelize): typeof AgreementAmendment {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends AgreementAmendment {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      agreementId: { type: DataTypes.UUID, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'proposed' },
      changes: { type: DataTypes.JSONB, allowNull: false },
      previousTerms: { type: DataTypes.JSONB, allowNull: false, defaultValue: {}, field: 'previous' },
      reason: { type: DataTypes.TEXT, allowNull: false },
      proposedSide: { type: DataTypes.TEXT, allowNull: false },
      proposedBy: { type: DataTypes.UUID, allowNull: true },
      decidedBy: { type: DataTypes.UUID, allowNull: true },
      decidedAt: { type: DataTypes.DATE, allowNull: true },
      versionAfter: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'AgreementAmendment', tableName: 'agreement_amendments' },
  );
  return Bound;
}
