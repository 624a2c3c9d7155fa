import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { BundleState, ColourFamily, ColourValue, CutKind, CutSize, Fibre, Offer, PieceInput } from '@scrap-relay/shared';
import type { BundlePhoto } from './bundle-photo.ts';
import type { Member } from './member.ts';

export class Bundle extends Model<InferAttributes<Bundle>, InferCreationAttributes<Bundle>> {
  declare id: CreationOptional<string>;
  declare sellerId: string;
  declare state: CreationOptional<BundleState>;
  declare title: CreationOptional<string>;
  declare description: CreationOptional<string>;
  declare offer: Offer | null;
  declare priceMinor: number | null;
  declare currency: string;
  declare meetingHandoverOk: CreationOptional<boolean>;
  declare quantity: CreationOptional<number>;
  declare quantityAvailable: CreationOptional<number>;
  declare weightGrams: number | null;
  declare fibre: Fibre | null;
  declare cutKinds: CreationOptional<CutKind[]>;
  declare cutSizes: CreationOptional<CutSize[]>;
  declare colourValue: ColourValue | null;
  declare colourFamily: ColourFamily | null;
  declare prewashed: CreationOptional<boolean>;
  declare smokeFree: CreationOptional<boolean>;
  declare petFree: CreationOptional<boolean>;
  declare pieces: CreationOptional<PieceInput[]>;
  declare reviewNotes: CreationOptional<string | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare reviewedAt: CreationOptional<Date | null>;
  declare onShelfAt: CreationOptional<Date | null>;
  declare expiresAt: CreationOptional<Date | null>;
  /** The end date the seller was last warned about (the expiry job); a relisted bundle is warned again. */
  declare expiryWarnedFor: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare photos?: NonAttribute<BundlePhoto[]>;
  declare seller?: NonAttribute<Member>;

  static initModel(sequelize: Sequelize) {
    Bundle.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        sellerId: { type: DataTypes.UUID, allowNull: false },
        state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
        title: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        offer: { type: DataTypes.TEXT, allowNull: true },
        priceMinor: { type: DataTypes.INTEGER, allowNull: true },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        meetingHandoverOk: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        quantity: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        quantityAvailable: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        weightGrams: { type: DataTypes.INTEGER, allowNull: true },
        fibre: { type: DataTypes.TEXT, allowNull: true },
        cutKinds: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        cutSizes: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        colourValue: { type: DataTypes.TEXT, allowNull: true },
        colourFamily: { type: DataTypes.TEXT, allowNull: true },
        prewashed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        smokeFree: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        petFree: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        pieces: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        reviewNotes: { type: DataTypes.TEXT, allowNull: true },
        submittedAt: { type: DataTypes.DATE, allowNull: true },
        reviewedAt: { type: DataTypes.DATE, allowNull: true },
        onShelfAt: { type: DataTypes.DATE, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: true },
        expiryWarnedFor: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'bundles' },
    );
  }
}
