import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class BundleReview extends Model<InferAttributes<BundleReview>, InferCreationAttributes<BundleReview>> {
  declare id: CreationOptional<string>;
  declare bundleId: string;
  declare reviewerId: string;
  declare decision: 'approve' | 'return';
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BundleReview.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        bundleId: { type: DataTypes.UUID, allowNull: false },
        reviewerId: { type: DataTypes.UUID, allowNull: false },
        decision: { type: DataTypes.TEXT, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'bundle_reviews', updatedAt: false },
    );
  }
}
