import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

// Failed sign-ins, kept in the database so the limit holds across processes and restarts.
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare scope: 'account' | 'address';
  declare subject: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    SignInAttempt.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        scope: { type: DataTypes.STRING(16), allowNull: false },
        subject: { type: DataTypes.STRING(254), allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'auth_sign_in_attempts', modelName: 'SignInAttempt', updatedAt: false },
    );
  }
}
