// A photo from the field (delivery, strength check or pickup), kept with its placement.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class PlacementPhoto extends Model<InferAttributes<PlacementPhoto>, InferCreationAttributes<PlacementPhoto>> {
  declare id: CreationOptional<string>;
  declare placementId: string;
  declare step: string;
  declare contentType: string;
  declare byteSize: number;
  declare data: Buffer;
  declare uploadedBy: string | null;
  declare recordedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}

export function definePlacementPhoto(sequelize: Sequelize): typeof PlacementPhoto {
  // A subclass per Sequelize instance, so each app keeps its own models.
  class Bound extends PlacementPhoto {}
  Bound.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      placementId: { type: DataTypes.UUID, allowNull: false },
      step: { type: DataTypes.TEXT, allowNull: false },
      contentType: { type: DataTypes.TEXT, allowNull: false },
      byteSize: { type: DataTypes.INTEGER, allowNull: false },
      data: { type: DataTypes.BLOB, allowNull: false },
      uploadedBy: { type: DataTypes.UUID, allowNull: true },
      recordedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'PlacementPhoto', tableName: 'placement_photos', updatedAt: false },
  );
  return Bound;
}
