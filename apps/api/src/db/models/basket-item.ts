import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One line of a member's basket: a bundle and how many copies they mean to ask for. */
export class BasketItem extends Model<InferAttributes<BasketItem>, InferCreationAttributes<BasketItem>> {
  declare memberId: string;
  declare bundleId: string;
  declare quantity: number;
  declare addedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BasketItem.init(
      {
        memberId: { type: DataTypes.UUID, primaryKey: true },
        bundleId: { type: DataTypes.UUID, primaryKey: true },
        quantity: { type: DataTypes.INTEGER, allowNull: false },
        addedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'basket_items', timestamps: false },
    );
  }
}
