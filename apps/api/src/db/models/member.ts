import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { OptionalEmailKind, PostalAddress, Role, UnitSystem } from '@scrap-relay/shared';

export class Member extends Model<InferAttributes<Member>, InferCreationAttributes<Member>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare email: string;
  declare passwordHash: string;
  declare roles: CreationOptional<Role[]>;
  declare newQuilterFlag: CreationOptional<boolean>;
  declare joinedAt: CreationOptional<Date>;
  declare emailVerifiedAt: Date | null;
  declare active: CreationOptional<boolean>;
  declare units: UnitSystem | null;
  declare postalAddress: CreationOptional<PostalAddress | null>;
  declare emailPreferences: CreationOptional<Partial<Record<OptionalEmailKind, boolean>>>;
  declare closedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Member.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.TEXT, allowNull: false },
        email: { type: DataTypes.TEXT, allowNull: false },
        passwordHash: { type: DataTypes.TEXT, allowNull: false },
        roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: ['member'] },
        newQuilterFlag: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        joinedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        emailVerifiedAt: { type: DataTypes.DATE, allowNull: true },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        units: { type: DataTypes.TEXT, allowNull: true },
        postalAddress: { type: DataTypes.JSONB, allowNull: true },
        emailPreferences: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'members' },
    );
  }
}
