import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** What was bought, with title, price and weight as they were at the time. */
export class OrderItem extends Model<InferAttributes<OrderItem>, InferCreationAttributes<OrderItem>> {
  declare id: CreationOptional<string>;
  declare orderId: string;
  declare bundleId: string;
  declare quantity: number;
  declare unitPriceMinor: number;
  declare title: string;
  declare weightGrams: number;

  static initModel(sequelize: Sequelize) {
    OrderItem.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        orderId: { type: DataTypes.UUID, allowNull: false },
        bundleId: { type: DataTypes.UUID, allowNull: false },
        quantity: { type: DataTypes.INTEGER, allowNull: false },
        unitPriceMinor: { type: DataTypes.INTEGER, allowNull: false },
        title: { type: DataTypes.TEXT, allowNull: false },
        weightGrams: { type: DataTypes.INTEGER, allowNull: false },
      },
      { sequelize, tableName: 'order_items', timestamps: false },
    );
  }
}
