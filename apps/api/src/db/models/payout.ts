import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Payout extends Model<InferAttributes<Payout>, InferCreationAttributes<Payout>> {
  declare id: CreationOptional<string>;
  declare sellerId: string;
  declare amountMinor: number;
  declare currency: string;
  declare method: string;
  declare reference: string;
  declare recordedBy: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Payout.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        sellerId: { type: DataTypes.UUID, allowNull: false },
        amountMinor: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        method: { type: DataTypes.TEXT, allowNull: false },
        reference: { type: DataTypes.TEXT, allowNull: false },
        recordedBy: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'payouts', updatedAt: false },
    );
  }
}
