import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * A photo as stored after the pipeline: a display size, a medium size and a thumbnail, no metadata, plus its
 * average colour. Photos stored before the medium size existed have no medium key.
 */
export class BundlePhoto extends Model<InferAttributes<BundlePhoto>, InferCreationAttributes<BundlePhoto>> {
  declare id: CreationOptional<string>;
  declare bundleId: string;
  declare position: number;
  declare displayKey: string;
  declare mediumKey: CreationOptional<string | null>;
  declare thumbKey: string;
  declare contentType: string;
  declare width: number;
  declare height: number;
  declare averageHex: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BundlePhoto.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        bundleId: { type: DataTypes.UUID, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        displayKey: { type: DataTypes.TEXT, allowNull: false },
        mediumKey: { type: DataTypes.TEXT, allowNull: true },
        thumbKey: { type: DataTypes.TEXT, allowNull: false },
        contentType: { type: DataTypes.TEXT, allowNull: false },
        width: { type: DataTypes.INTEGER, allowNull: false },
        height: { type: DataTypes.INTEGER, allowNull: false },
        averageHex: { type: DataTypes.CHAR(7), allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'bundle_photos', updatedAt: false },
    );
  }
}
