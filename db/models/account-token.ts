import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const ACCOUNT_TOKEN_PURPOSES = ['verify', 'reset', 'change-email'] as const;
export type AccountTokenPurpose = (typeof ACCOUNT_TOKEN_PURPOSES)[number];

// One e-mailed link: verify an address, reset a password or move the account to a new address.
export class AccountToken extends Model<InferAttributes<AccountToken>, InferCreationAttributes<AccountToken>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare purpose: AccountTokenPurpose;
  /** The address the link was sent to (for change-email: the new address). */
  declare email: string;
  declare nonceHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    AccountToken.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        purpose: { type: DataTypes.STRING(16), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        nonceHash: { type: DataTypes.CHAR(64), allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'account_tokens', modelName: 'AccountToken' },
    );
  }
}
