import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class OrderProblem extends Model<InferAttributes<OrderProblem>, InferCreationAttributes<OrderProblem>> {
  declare id: CreationOptional<string>;
  declare orderId: string;
  declare reporterId: string;
  declare message: string;
  declare resolvedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OrderProblem.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        orderId: { type: DataTypes.UUID, allowNull: false },
        reporterId: { type: DataTypes.UUID, allowNull: false },
        message: { type: DataTypes.TEXT, allowNull: false },
        resolvedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'order_problems', updatedAt: false },
    );
  }
}
