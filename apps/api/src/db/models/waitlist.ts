import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { WaitlistStatus } from '@scrap-relay/shared';
import type { Member } from './member.ts';

export class WaitlistEntry extends Model<InferAttributes<WaitlistEntry>, InferCreationAttributes<WaitlistEntry>> {
  declare id: CreationOptional<string>;
  declare memberId: string;
  declare status: CreationOptional<WaitlistStatus>;
  declare joinedAt: Date;
  declare removedReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare member?: NonAttribute<Member>;

  static initModel(sequelize: Sequelize) {
    WaitlistEntry.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        memberId: { type: DataTypes.UUID, allowNull: false },
        status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'waiting' },
        joinedAt: { type: DataTypes.DATE, allowNull: false },
        removedReason: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'waitlist_entries' },
    );
  }
}

export class WaitlistOffer extends Model<InferAttributes<WaitlistOffer>, InferCreationAttributes<WaitlistOffer>> {
  declare id: CreationOptional<string>;
  declare entryId: string;
  declare bundleId: string;
  declare status: CreationOptional<'open' | 'accepted' | 'declined' | 'lapsed' | 'withdrawn'>;
  declare offeredAt: Date;
  declare expiresAt: Date;
  declare answeredAt: CreationOptional<Date | null>;
  /** When the halfway reminder went (`remindOpenOffers`), set in the statement that picks the offer. */
  declare reminderSentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    WaitlistOffer.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        entryId: { type: DataTypes.UUID, allowNull: false },
        bundleId: { type: DataTypes.UUID, allowNull: false },
        status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'open' },
        offeredAt: { type: DataTypes.DATE, allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        answeredAt: { type: DataTypes.DATE, allowNull: true },
        reminderSentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'waitlist_offers' },
    );
  }
}
