import type { Sequelize } from 'sequelize';
import { Bundle } from './bundle.ts';
import { BundlePhoto } from './bundle-photo.ts';
import { BundleReview } from './bundle-review.ts';
import { Guild } from './guild.ts';
import { Member } from './member.ts';
import { MemberToken } from './member-token.ts';
import { Wish } from './wish.ts';

export { Bundle, BundlePhoto, BundleReview, Guild, Member, MemberToken, Wish };
export { DEFAULT_GUILD_SETTINGS, type GuildSettingsDocument } from './guild.ts';
export type { TokenPurpose as TokenPurposeType } from './member-token.ts';

/** Initialises every model on one connection and wires the associations in one place. */
export function initModels(sequelize: Sequelize) {
  for (const model of [Guild, Member, MemberToken, Bundle, BundlePhoto, BundleReview, Wish]) model.initModel(sequelize);

  Member.hasMany(MemberToken, { foreignKey: 'memberId', as: 'tokens' });
  MemberToken.belongsTo(Member, { foreignKey: 'memberId', as: 'member' });
  Member.hasMany(Bundle, { foreignKey: 'sellerId', as: 'bundles' });
  Bundle.belongsTo(Member, { foreignKey: 'sellerId', as: 'seller' });
  Bundle.hasMany(BundlePhoto, { foreignKey: 'bundleId', as: 'photos' });
  BundlePhoto.belongsTo(Bundle, { foreignKey: 'bundleId', as: 'bundle' });
  Bundle.hasMany(BundleReview, { foreignKey: 'bundleId', as: 'reviews' });
  Member.hasMany(Wish, { foreignKey: 'memberId', as: 'wishes' });
}
