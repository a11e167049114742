// A beekeeper's offer of colonies to a hive request, at the asked price or another.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Organization } from './organization.model.js';
import type { Agreement } from './agreement.model.js';
import type { HiveRequest } from './hive-request.model.js';
import type { CommitmentDto } from '../../../../shared/schemas/requests.js';

export class Commitment extends Model<InferAttributes<Commitment>, InferCreationAttributes<Commitment>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare apiaryId: string;
  declare colonies: number;
  declare proposedPriceCents: number | null;
  declare state: CreationOptional<CommitmentDto['state']>;
  declare note: string | null;
  declare createdBy: string | null;
  declare decidedBy: CreationOptional<string | null>;
  declare decidedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare apiary?: NonAttribute<Organization>;
  declare agreement?: NonAttribute<Agreement | null>;
  declare request?: NonAttribute<HiveRequest>;
}

export function defineCommitment(sequelize: Sequelize): typeof Commitment {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends Commitment {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      requestId: { type: DataTypes.UUID, allowNull: false },
      apiaryId: { type: DataTypes.UUID, allowNull: false },
      colonies: { type: DataTypes.INTEGER, allowNull: false },
      proposedPriceCents: { type: DataTypes.INTEGER, allowNull: true },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'offered' },
      note: { type: DataTypes.TEXT, allowNull: true },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      decidedBy: { type: DataTypes.UUID, allowNull: true },
      decidedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize, modelName: 'Commitment', tableName: 'commitments',
      scopes: {
        /** Offered and accepted commitments: the ones that hold colonies of a request. */
        holding: { where: { state: ['offered', 'accepted'] } },
      },
    },
  );
  return Bound;
}
