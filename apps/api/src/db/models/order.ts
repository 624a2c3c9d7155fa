import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import { canOrderTransition, type OrderState, type PostalAddress, type PostageQuote } from '@scrap-relay/shared';
import type { Meeting } from './meeting.ts';
import type { Member } from './member.ts';
import type { OrderItem } from './order-item.ts';
import type { OrderDispute } from './order-dispute.ts';
import type { OrderProblem } from './order-problem.ts';

export class Order extends Model<InferAttributes<Order>, InferCreationAttributes<Order>> {
  declare id: CreationOptional<string>;
  declare reference: string;
  declare buyerId: string;
  declare sellerId: string;
  declare state: OrderState;
  declare fulfilment: 'post' | 'meeting';
  declare meetingId: string | null;
  declare address: PostalAddress | null;
  declare currency: string;
  declare subtotalMinor: number;
  declare postageMinor: number;
  declare chargeMinor: number;
  declare guildFeeMinor: number;
  declare processingCostMinor: number;
  declare sellerCreditMinor: number;
  declare postageQuote: PostageQuote | null;
  declare stripeSessionId: CreationOptional<string | null>;
  declare checkoutUrl: CreationOptional<string | null>;
  declare stripePaymentIntentId: CreationOptional<string | null>;
  declare holdExpiresAt: Date | null;
  declare paidAt: CreationOptional<Date | null>;
  declare postedAt: CreationOptional<Date | null>;
  declare postReminderSentAt: CreationOptional<Date | null>;
  declare trackingNumber: CreationOptional<string | null>;
  declare receivedAt: CreationOptional<Date | null>;
  declare handedOverAt: CreationOptional<Date | null>;
  declare handedOverBy: CreationOptional<string | null>;
  declare cancelledAt: CreationOptional<Date | null>;
  declare cancelReason: CreationOptional<string | null>;
  declare refundedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare items?: NonAttribute<OrderItem[]>;
  declare buyer?: NonAttribute<Member>;
  declare seller?: NonAttribute<Member>;
  declare meeting?: NonAttribute<Meeting | null>;
  declare problems?: NonAttribute<OrderProblem[]>;
  declare dispute?: NonAttribute<OrderDispute | null>;

  static initModel(sequelize: Sequelize) {
    // A fresh definition per column: Sequelize writes the column name into the object it is given.
    const date = () => ({ type: DataTypes.DATE, allowNull: true });
    Order.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        reference: { type: DataTypes.TEXT, allowNull: false },
        buyerId: { type: DataTypes.UUID, allowNull: false },
        sellerId: { type: DataTypes.UUID, allowNull: false },
        state: { type: DataTypes.TEXT, allowNull: false },
        fulfilment: { type: DataTypes.TEXT, allowNull: false },
        meetingId: { type: DataTypes.UUID, allowNull: true },
        address: { type: DataTypes.JSONB, allowNull: true },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        subtotalMinor: { type: DataTypes.INTEGER, allowNull: false },
        postageMinor: { type: DataTypes.INTEGER, allowNull: false },
        chargeMinor: { type: DataTypes.INTEGER, allowNull: false },
        guildFeeMinor: { type: DataTypes.INTEGER, allowNull: false },
        processingCostMinor: { type: DataTypes.INTEGER, allowNull: false },
        sellerCreditMinor: { type: DataTypes.INTEGER, allowNull: false },
        postageQuote: { type: DataTypes.JSONB, allowNull: true },
        stripeSessionId: { type: DataTypes.TEXT, allowNull: true },
        checkoutUrl: { type: DataTypes.TEXT, allowNull: true },
        stripePaymentIntentId: { type: DataTypes.TEXT, allowNull: true },
        holdExpiresAt: date(),
        paidAt: date(),
        postedAt: date(),
        postReminderSentAt: date(),
        trackingNumber: { type: DataTypes.TEXT, allowNull: true },
        receivedAt: date(),
        handedOverAt: date(),
        handedOverBy: { type: DataTypes.UUID, allowNull: true },
        cancelledAt: date(),
        cancelReason: { type: DataTypes.TEXT, allowNull: true },
        refundedAt: date(),
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'orders',
        hooks: {
          // The last guard on the order's life: a move the shared state machine does not list is a bug, refused before it is written.
          beforeUpdate(order) {
            if (!order.changed('state')) return;
            const from = order.previous('state') as OrderState;
            if (!canOrderTransition(from, order.state)) throw new Error(`order ${order.id} may not move from ${from} to ${order.state}`);
          },
        },
      },
    );
  }
}
