import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  // One row per counted subject (an account's e-mail, a client address), updated under a row lock, so
  // parallel guesses cannot all read "under the limit" before any of them is counted.
  await qi.createTable('auth_sign_in_limits', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    scope: { type: DataTypes.STRING(16), allowNull: false },
    subject: { type: DataTypes.STRING(254), allowNull: false },
    failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    last_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    next_allowed_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('auth_sign_in_limits', ['scope', 'subject'], { unique: true, name: 'auth_sign_in_limits_subject' });
  await qi.dropTable('auth_sign_in_attempts');
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('auth_sign_in_attempts', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    scope: { type: DataTypes.STRING(16), allowNull: false },
    subject: { type: DataTypes.STRING(254), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('auth_sign_in_attempts', ['scope', 'subject', 'created_at']);
  await qi.dropTable('auth_sign_in_limits');
}
