import type { Sequelize } from 'sequelize';
import { Bundle } from './bundle.ts';
import { BundlePhoto } from './bundle-photo.ts';
import { BundleReview } from './bundle-review.ts';
import { Guild } from './guild.ts';
import { Member } from './member.ts';
import { MemberToken } from './member-token.ts';
import { Wish } from './wish.ts';
import { BasketItem } from './basket-item.ts';
import { Meeting } from './meeting.ts';
import { Order } from './order.ts';
import { OrderItem } from './order-item.ts';
import { OrderDispute } from './order-dispute.ts';
import { OrderProblem } from './order-problem.ts';
import { Payout } from './payout.ts';
import { LedgerEntry } from './ledger-entry.ts';
import { StarterClaim } from './starter-claim.ts';
import { WaitlistEntry, WaitlistOffer } from './waitlist.ts';

export { BasketItem, Bundle, BundlePhoto, BundleReview, Guild, LedgerEntry, Meeting, Member, MemberToken, Order, OrderDispute, OrderItem, OrderProblem, Payout, StarterClaim, WaitlistEntry, WaitlistOffer, Wish };
export { DEFAULT_GUILD_SETTINGS, type GuildSettingsDocument } from './guild.ts';
export type { TokenPurpose as TokenPurposeType } from './member-token.ts';

/** Initialises every model on one connection and wires the associations in one place. */
export function initModels(sequelize: Sequelize) {
  for (const model of [Guild, Member, MemberToken, Bundle, BundlePhoto, BundleReview, Wish, Meeting, Order, OrderItem, OrderProblem, OrderDispute, Payout, LedgerEntry, StarterClaim, WaitlistEntry, WaitlistOffer, BasketItem]) {
    model.initModel(sequelize);
  }

  Member.hasMany(MemberToken, { foreignKey: 'memberId', as: 'tokens' });
  MemberToken.belongsTo(Member, { foreignKey: 'memberId', as: 'member' });
  Member.hasMany(Bundle, { foreignKey: 'sellerId', as: 'bundles' });
  Bundle.belongsTo(Member, { foreignKey: 'sellerId', as: 'seller' });
  Bundle.hasMany(BundlePhoto, { foreignKey: 'bundleId', as: 'photos' });
  BundlePhoto.belongsTo(Bundle, { foreignKey: 'bundleId', as: 'bundle' });
  Bundle.hasMany(BundleReview, { foreignKey: 'bundleId', as: 'reviews' });
  Member.hasMany(Wish, { foreignKey: 'memberId', as: 'wishes' });
  Order.hasMany(OrderItem, { foreignKey: 'orderId', as: 'items' });
  OrderItem.belongsTo(Bundle, { foreignKey: 'bundleId', as: 'bundle' });
  Order.belongsTo(Member, { foreignKey: 'buyerId', as: 'buyer' });
  Order.belongsTo(Member, { foreignKey: 'sellerId', as: 'seller' });
  Order.belongsTo(Meeting, { foreignKey: 'meetingId', as: 'meeting' });
  Order.hasMany(OrderProblem, { foreignKey: 'orderId', as: 'problems' });
  Order.hasOne(OrderDispute, { foreignKey: 'orderId', as: 'dispute' });
  StarterClaim.belongsTo(Bundle, { foreignKey: 'bundleId', as: 'bundle' });
  StarterClaim.belongsTo(Member, { foreignKey: 'memberId', as: 'member' });
  StarterClaim.belongsTo(Meeting, { foreignKey: 'meetingId', as: 'meeting' });
  WaitlistEntry.belongsTo(Member, { foreignKey: 'memberId', as: 'member' });
}
