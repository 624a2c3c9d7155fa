import type { Sequelize } from 'sequelize';
import { Guild } from './guild.ts';
import { Member } from './member.ts';
import { MemberToken } from './member-token.ts';

export { Guild, Member, MemberToken };
export { DEFAULT_GUILD_SETTINGS, type GuildSettingsDocument } from './guild.ts';
export type { TokenPurpose as TokenPurposeType } from './member-token.ts';

/** Initialises every model on one connection and wires the associations in one place. */
export function initModels(sequelize: Sequelize) {
  Guild.initModel(sequelize);
  Member.initModel(sequelize);
  MemberToken.initModel(sequelize);

  Member.hasMany(MemberToken, { foreignKey: 'memberId', as: 'tokens' });
  MemberToken.belongsTo(Member, { foreignKey: 'memberId', as: 'member' });
}
