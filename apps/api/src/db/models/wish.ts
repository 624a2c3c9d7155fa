import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ShelfFilters } from '@scrap-relay/shared';

export class Wish extends Model<InferAttributes<Wish>, InferCreationAttributes<Wish>> {
  declare id: CreationOptional<string>;
  declare memberId: string;
  declare name: string;
  declare filters: ShelfFilters;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Wish.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        memberId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        filters: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'wishes', updatedAt: false },
    );
  }
}
