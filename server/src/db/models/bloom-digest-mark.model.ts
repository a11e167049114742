// Up to when an apiary's e-mail digest of bloom-window revisions has reported.
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class BloomDigestMark extends Model<InferAttributes<BloomDigestMark>, InferCreationAttributes<BloomDigestMark>> {
  declare apiaryId: string;
  declare reportedThrough: Date;
}

export function defineBloomDigestMark(sequelize: Sequelize): typeof BloomDigestMark {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends BloomDigestMark {}
  Bound.init(
    {
      apiaryId: { type: DataTypes.UUID, primaryKey: true },
      reportedThrough: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, modelName: 'BloomDigestMark', tableName: 'bloom_digest_marks', underscored: true, timestamps: false },
  );
  return Bound;
}
