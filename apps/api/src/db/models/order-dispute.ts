import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The cardholder's bank questioning an order's payment, as the card service reports it (one per order). */
export class OrderDispute extends Model<InferAttributes<OrderDispute>, InferCreationAttributes<OrderDispute>> {
  declare id: CreationOptional<string>;
  declare orderId: string;
  declare stripeDisputeId: string;
  /** The card service's status (`needs_response`, `under_review`, `won`, `lost`, …); `disputeStage` reads it. */
  declare status: string;
  declare reason: string;
  declare amountMinor: number;
  declare currency: string;
  declare evidenceDueBy: Date | null;
  /** The card service's fee for the dispute as it stands in the ledger (0 when none was charged or it came back): derived from `feeMovements`. */
  declare feeMinor: CreationOptional<number>;
  /** Every balance movement the card service reported for the dispute, by id, with its fee (see `bookDisputeFee`). */
  declare feeMovements: CreationOptional<Record<string, number>>;
  declare openedAt: Date;
  declare closedAt: CreationOptional<Date | null>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OrderDispute.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        orderId: { type: DataTypes.UUID, allowNull: false },
        stripeDisputeId: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.TEXT, allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: false },
        amountMinor: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        evidenceDueBy: { type: DataTypes.DATE, allowNull: true },
        feeMinor: {
          type: DataTypes.VIRTUAL,
          get(this: OrderDispute) {
            return Object.values(this.getDataValue('feeMovements') ?? {}).reduce((sum, fee) => sum + fee, 0);
          },
        },
        feeMovements: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        openedAt: { type: DataTypes.DATE, allowNull: false },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'order_disputes', createdAt: false },
    );
  }
}
