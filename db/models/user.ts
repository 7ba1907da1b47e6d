import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const SITE_ROLES = ['member', 'admin'] as const;
export type SiteRole = (typeof SITE_ROLES)[number];

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare handle: string;
  declare passwordHash: string;
  declare siteRole: CreationOptional<SiteRole>;
  declare emailVerifiedAt: CreationOptional<Date | null>;
  declare sessionVersion: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(80), allowNull: false },
        handle: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        siteRole: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'member' },
        emailVerifiedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        sessionVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        deletedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', modelName: 'User' },
    );
  }
}
