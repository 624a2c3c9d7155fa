import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A photo as stored after the pipeline: a display size and a thumbnail, no metadata, plus its average colour. */
export class BundlePhoto extends Model<InferAttributes<BundlePhoto>, InferCreationAttributes<BundlePhoto>> {
  declare id: CreationOptional<string>;
  declare bundleId: string;
  declare position: number;
  declare displayKey: string;
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
