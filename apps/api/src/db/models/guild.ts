import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { PostageTable, UnitSystem } from '@scrap-relay/shared';

/** Settings kept as one validated document beside the guild's name; see guildSettingsSchema. */
export interface GuildSettingsDocument {
  newcomerWindowMonths: number;
  shelfLimitDays: number;
  holdMinutes: number;
  guildFeeBasisPoints: number;
  processingPercentBasisPoints: number;
  processingFixedMinor: number;
  starterLimitPerWindow: number;
  starterWindowDays: number;
  starterOfferHours: number;
  starterPostingAllowed: boolean;
  /** Absent in documents saved before it existed: UTC. */
  timeZone?: string;
}

export const DEFAULT_GUILD_SETTINGS: GuildSettingsDocument = {
  newcomerWindowMonths: 12,
  shelfLimitDays: 90,
  holdMinutes: 30,
  guildFeeBasisPoints: 1000,
  processingPercentBasisPoints: 290,
  processingFixedMinor: 30,
  starterLimitPerWindow: 1,
  starterWindowDays: 90,
  starterOfferHours: 72,
  starterPostingAllowed: false,
  timeZone: 'UTC',
};

export class Guild extends Model<InferAttributes<Guild>, InferCreationAttributes<Guild>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare town: string;
  declare currency: string;
  declare defaultUnits: UnitSystem;
  declare settings: GuildSettingsDocument;
  declare inviteCode: string;
  declare postageTable: CreationOptional<PostageTable | null>;
  declare inviteCodeRotatedAt: CreationOptional<Date>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Guild.init(
      {
        id: { type: DataTypes.SMALLINT, primaryKey: true, defaultValue: 1 },
        name: { type: DataTypes.TEXT, allowNull: false },
        town: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        defaultUnits: { type: DataTypes.TEXT, allowNull: false },
        settings: {
          type: DataTypes.JSONB,
          allowNull: false,
          get(this: Guild) {
            return { ...DEFAULT_GUILD_SETTINGS, ...(this.getDataValue('settings') ?? {}) };
          },
        },
        inviteCode: { type: DataTypes.TEXT, allowNull: false },
        postageTable: { type: DataTypes.JSONB, allowNull: true },
        inviteCodeRotatedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'guild' },
    );
  }
}
