// A grower's request for colonies on some of its blocks: strength, dates, terms. The
// expected time on site is a tstzrange worked out from the arrive/depart rules.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Organization } from './organization.model.js';
import type { HiveRequestBlock } from './hive-request-block.model.js';
import type { DropSite } from './drop-site.model.js';
import type { RequestState } from '../../../../shared/schemas/requests.js';
import type { TimeRange } from '../time-range.js';

export class HiveRequest extends Model<InferAttributes<HiveRequest>, InferCreationAttributes<HiveRequest>> {
  declare id: CreationOptional<string>;
  declare farmId: string;
  declare title: string;
  declare state: CreationOptional<RequestState>;
  declare coloniesRequested: number;
  declare minFramesOfBees: number;
  declare minFramesOfBrood: number | null;
  declare arriveRule: 'bloom-stage' | 'date';
  declare arriveBloomPercent: number | null;
  declare arriveOn: string | null;
  declare departRule: 'petal-fall' | 'date';
  declare departOn: string | null;
  declare expectedOnSite: TimeRange | null;
  declare pricePerColonyCents: number;
  declare currency: CreationOptional<string>;
  declare depositShareBp: CreationOptional<number>;
  declare balanceDueDays: CreationOptional<number>;
  declare lateInterestBpPerMonth: CreationOptional<number>;
  declare belowMinimumRateBp: CreationOptional<number>;
  declare extraMoveFeeCents: CreationOptional<number>;
  declare noticeHours: CreationOptional<number>;
  declare respondBy: string | null;
  declare notes: string | null;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare farm?: NonAttribute<Organization>;
  declare blockShares?: NonAttribute<HiveRequestBlock[]>;
  declare dropSites?: NonAttribute<DropSite[]>;
}

export function defineHiveRequest(sequelize: Sequelize): typeof HiveRequest {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends HiveRequest {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      farmId: { type: DataTypes.UUID, allowNull: false },
      title: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
      coloniesRequested: { type: DataTypes.INTEGER, allowNull: false },
      minFramesOfBees: { type: DataTypes.DOUBLE, allowNull: false },
      minFramesOfBrood: { type: DataTypes.DOUBLE, allowNull: true },
      arriveRule: { type: DataTypes.TEXT, allowNull: false },
      arriveBloomPercent: { type: DataTypes.INTEGER, allowNull: true },
      arriveOn: { type: DataTypes.DATEONLY, allowNull: true },
      departRule: { type: DataTypes.TEXT, allowNull: false },
      departOn: { type: DataTypes.DATEONLY, allowNull: true },
      expectedOnSite: { type: DataTypes.RANGE(DataTypes.DATE), allowNull: true },
      pricePerColonyCents: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'USD' },
      depositShareBp: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 5000 },
      balanceDueDays: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
      lateInterestBpPerMonth: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 100 },
      belowMinimumRateBp: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      extraMoveFeeCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      noticeHours: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 48 },
      respondBy: { type: DataTypes.DATEONLY, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize, modelName: 'HiveRequest', tableName: 'hive_requests',
      scopes: { ofFarm: (farmId: string) => ({ where: { farmId } }) },
    },
  );
  return Bound;
}
