import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * Sign-in attempts counted per subject (an account's e-mail or a client address): one row each, kept in
 * the database so the limits hold across processes and restarts (lib/server/sign-in-limits.ts).
 */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare scope: 'account' | 'address';
  declare subject: string;
  /** Attempts in the current run that did not end in a sign-in. */
  declare failures: CreationOptional<number>;
  declare lastAttemptAt: Date;
  /** No attempt is checked before this moment. */
  declare nextAllowedAt: Date;

  static initModel(sequelize: Sequelize): void {
    SignInAttempt.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        scope: { type: DataTypes.STRING(16), allowNull: false },
        subject: { type: DataTypes.STRING(254), allowNull: false },
        failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        lastAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
        nextAllowedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'auth_sign_in_limits', modelName: 'SignInAttempt', timestamps: false },
    );
  }
}
