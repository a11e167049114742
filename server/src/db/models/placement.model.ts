// Colonies of an agreement at one drop site: scheduled, delivered, picked up. on_site is
// the agreement's window until delivery, then [delivered_at, picked_up_at).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Agreement } from './agreement.model.js';
import type { DropSite } from './drop-site.model.js';
import type { User } from './user.model.js';
import type { StrengthCheck } from './strength-check.model.js';
import type { PlacementPhoto } from './placement-photo.model.js';
import type { GeoPoint } from '../../../../shared/schemas/common.js';
import type { PlacementState } from '../../../../shared/schemas/placements.js';
import type { TimeRange } from '../time-range.js';

export class Placement extends Model<InferAttributes<Placement>, InferCreationAttributes<Placement>> {
  declare id: CreationOptional<string>;
  declare agreementId: string;
  declare dropSiteId: string;
  declare state: CreationOptional<PlacementState>;
  declare coloniesPlanned: number;
  declare onSite: TimeRange;
  declare coloniesDelivered: CreationOptional<number | null>;
  declare deliveredAt: CreationOptional<Date | null>;
  declare deliveredLocation: CreationOptional<GeoPoint | null>;
  declare deliveredBy: CreationOptional<string | null>;
  declare coloniesPickedUp: CreationOptional<number | null>;
  declare pickedUpAt: CreationOptional<Date | null>;
  declare pickedUpBy: CreationOptional<string | null>;
  /** The phone's own time for the step, and when the server received it (offline field work). */
  declare deliveredRecordedAt: CreationOptional<Date | null>;
  declare deliveredReceivedAt: CreationOptional<Date | null>;
  declare deliveredAccuracyM: CreationOptional<number | null>;
  declare pickedUpRecordedAt: CreationOptional<Date | null>;
  declare pickedUpReceivedAt: CreationOptional<Date | null>;
  declare disputeNote: CreationOptional<string | null>;
  declare disputeStep: CreationOptional<'delivery' | 'pickup' | null>;
  declare disputedCount: CreationOptional<number | null>;
  declare disputedBy: CreationOptional<string | null>;
  declare disputedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare agreement?: NonAttribute<Agreement>;
  declare dropSite?: NonAttribute<DropSite>;
  declare deliverer?: NonAttribute<User | null>;
  declare picker?: NonAttribute<User | null>;
  declare disputer?: NonAttribute<User | null>;
  declare strengthChecks?: NonAttribute<StrengthCheck[]>;
  declare photos?: NonAttribute<PlacementPhoto[]>;
}

export function definePlacement(sequelize: Sequelize): typeof Placement {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Placement {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      agreementId: { type: DataTypes.UUID, allowNull: false },
      dropSiteId: { type: DataTypes.UUID, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'scheduled' },
      coloniesPlanned: { type: DataTypes.INTEGER, allowNull: false },
      onSite: { type: DataTypes.RANGE(DataTypes.DATE), allowNull: false },
      coloniesDelivered: { type: DataTypes.INTEGER, allowNull: true },
      deliveredAt: { type: DataTypes.DATE, allowNull: true },
      deliveredLocation: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: true },
      deliveredBy: { type: DataTypes.UUID, allowNull: true },
      coloniesPickedUp: { type: DataTypes.INTEGER, allowNull: true },
      pickedUpAt: { type: DataTypes.DATE, allowNull: true },
      pickedUpBy: { type: DataTypes.UUID, allowNull: true },
      deliveredRecordedAt: { type: DataTypes.DATE, allowNull: true },
      deliveredReceivedAt: { type: DataTypes.DATE, allowNull: true },
      deliveredAccuracyM: { type: DataTypes.DOUBLE, allowNull: true },
      pickedUpRecordedAt: { type: DataTypes.DATE, allowNull: true },
      pickedUpReceivedAt: { type: DataTypes.DATE, allowNull: true },
      disputeNote: { type: DataTypes.TEXT, allowNull: true },
      disputeStep: { type: DataTypes.TEXT, allowNull: true },
      disputedCount: { type: DataTypes.INTEGER, allowNull: true },
      disputedBy: { type: DataTypes.UUID, allowNull: true },
      disputedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Placement', tableName: 'placements' },
  );
  return Bound;
}
