import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { LedgerEntryKind } from '@scrap-relay/shared';

/** One side of a money movement; the rows of a transactionId sum to zero. */
export class LedgerEntry extends Model<InferAttributes<LedgerEntry>, InferCreationAttributes<LedgerEntry>> {
  declare id: CreationOptional<string>;
  declare transactionId: string;
  declare orderId: string | null;
  declare payoutId: string | null;
  declare kind: LedgerEntryKind;
  declare reverses: string | null;
  declare account: string;
  declare amountMinor: number;
  declare currency: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LedgerEntry.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        transactionId: { type: DataTypes.UUID, allowNull: false },
        orderId: { type: DataTypes.UUID, allowNull: true },
        payoutId: { type: DataTypes.UUID, allowNull: true },
        kind: { type: DataTypes.TEXT, allowNull: false },
        reverses: { type: DataTypes.TEXT, allowNull: true },
        account: { type: DataTypes.TEXT, allowNull: false },
        amountMinor: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      // The time is the service's clock, passed in, so statements can be tested by month.
      { sequelize, tableName: 'ledger_entries', timestamps: false },
    );
  }
}
