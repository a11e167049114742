// A pollination agreement between a farm and an apiary business, made from an accepted
// commitment: the request's terms copied, confirmed by both sides, changed only by amendment.
import { DataTypes, Model, Op, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Organization } from './organization.model.js';
import type { User } from './user.model.js';
import type { HiveRequest } from './hive-request.model.js';
import type { AgreementAmendment } from './agreement-amendment.model.js';
import type { AgreementState } from '../../../../shared/schemas/agreements.js';
import type { AgreementClause } from '../../../../shared/domain/agreement-clauses.js';
import type { TimeRange } from '../time-range.js';

export class Agreement extends Model<InferAttributes<Agreement>, InferCreationAttributes<Agreement>> {
  declare id: CreationOptional<string>;
  declare commitmentId: string;
  declare requestId: string;
  declare farmId: string;
  declare apiaryId: string;
  declare state: CreationOptional<AgreementState>;
  declare version: CreationOptional<number>;
  declare colonies: number;
  declare pricePerColonyCents: number;
  declare currency: string;
  declare minFramesOfBees: number;
  declare minFramesOfBrood: number | null;
  declare expectedOnSite: TimeRange;
  declare noticeHours: number;
  declare removalNoticeHours: CreationOptional<number>;
  declare depositShareBp: number;
  declare balanceDueDays: number;
  declare lateInterestBpPerMonth: number;
  declare belowMinimumRateBp: number;
  declare extraMoveFeeCents: number;
  declare reminderIntervalDays: CreationOptional<number>;
  declare clauses: CreationOptional<AgreementClause[]>;
  declare farmConfirmedBy: CreationOptional<string | null>;
  declare farmConfirmedAt: CreationOptional<Date | null>;
  declare apiaryConfirmedBy: CreationOptional<string | null>;
  declare apiaryConfirmedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare request?: NonAttribute<HiveRequest>;
  declare farm?: NonAttribute<Organization>;
  declare apiary?: NonAttribute<Organization>;
  declare farmConfirmer?: NonAttribute<User | null>;
  declare apiaryConfirmer?: NonAttribute<User | null>;
  declare amendments?: NonAttribute<AgreementAmendment[]>;
}

export function defineAgreement(sequelize: Sequelize): typeof Agreement {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Agreement {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      commitmentId: { type: DataTypes.UUID, allowNull: false },
      requestId: { type: DataTypes.UUID, allowNull: false },
      farmId: { type: DataTypes.UUID, allowNull: false },
      apiaryId: { type: DataTypes.UUID, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'awaiting-signatures' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      colonies: { type: DataTypes.INTEGER, allowNull: false },
      pricePerColonyCents: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.CHAR(3), allowNull: false },
      minFramesOfBees: { type: DataTypes.DOUBLE, allowNull: false },
      minFramesOfBrood: { type: DataTypes.DOUBLE, allowNull: true },
      expectedOnSite: { type: DataTypes.RANGE(DataTypes.DATE), allowNull: false },
      noticeHours: { type: DataTypes.INTEGER, allowNull: false },
      removalNoticeHours: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 48 },
      depositShareBp: { type: DataTypes.INTEGER, allowNull: false },
      balanceDueDays: { type: DataTypes.INTEGER, allowNull: false },
      lateInterestBpPerMonth: { type: DataTypes.INTEGER, allowNull: false },
      belowMinimumRateBp: { type: DataTypes.INTEGER, allowNull: false },
      extraMoveFeeCents: { type: DataTypes.INTEGER, allowNull: false },
      reminderIntervalDays: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 7 },
      clauses: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      farmConfirmedBy: { type: DataTypes.UUID, allowNull: true },
      farmConfirmedAt: { type: DataTypes.DATE, allowNull: true },
      apiaryConfirmedBy: { type: DataTypes.UUID, allowNull: true },
      apiaryConfirmedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize, modelName: 'Agreement', tableName: 'agreements',
      scopes: {
        /** Agreements the organization is a party to, on either side. */
        ofParty: (organizationId: string) => ({ where: { [Op.or]: [{ farmId: organizationId }, { apiaryId: organizationId }] } }),
      },
    },
  );
  return Bound;
}
