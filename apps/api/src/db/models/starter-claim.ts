import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Bundle } from './bundle.ts';
import type { Meeting } from './meeting.ts';
import type { Member } from './member.ts';

export class StarterClaim extends Model<InferAttributes<StarterClaim>, InferCreationAttributes<StarterClaim>> {
  declare id: CreationOptional<string>;
  declare bundleId: string;
  declare memberId: string;
  declare meetingId: string | null;
  declare orderId: CreationOptional<string | null>;
  declare state: CreationOptional<'claimed' | 'handed_over' | 'cancelled'>;
  declare claimedAt: Date;
  declare handedOverAt: CreationOptional<Date | null>;
  declare handedOverBy: CreationOptional<string | null>;
  declare cancelledAt: CreationOptional<Date | null>;
  declare cancelReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare bundle?: NonAttribute<Bundle>;
  declare member?: NonAttribute<Member>;
  declare meeting?: NonAttribute<Meeting | null>;

  static initModel(sequelize: Sequelize) {
    StarterClaim.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        bundleId: { type: DataTypes.UUID, allowNull: false },
        memberId: { type: DataTypes.UUID, allowNull: false },
        meetingId: { type: DataTypes.UUID, allowNull: true },
        orderId: { type: DataTypes.UUID, allowNull: true },
        state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'claimed' },
        claimedAt: { type: DataTypes.DATE, allowNull: false },
        handedOverAt: { type: DataTypes.DATE, allowNull: true },
        handedOverBy: { type: DataTypes.UUID, allowNull: true },
        cancelledAt: { type: DataTypes.DATE, allowNull: true },
        cancelReason: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'starter_claims' },
    );
  }
}
