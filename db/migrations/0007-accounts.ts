import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  // An address counts as verified once its owner followed a signed link sent to it; until then the
  // account may read and build, but not comment, follow or accept an invitation.
  await qi.addColumn('users', 'email_verified_at', { type: DataTypes.DATE, allowNull: true });
  // Carried in the session cookie at sign-in; raising it ends every earlier session of the account.
  await qi.addColumn('users', 'session_version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
  // Set when a member deletes the account: the row stays, emptied, so kept logs and flags have an author.
  await qi.addColumn('users', 'deleted_at', { type: DataTypes.DATE, allowNull: true });

  // Signed, single-use, expiring links sent by e-mail: verify an address, reset a password, change an address.
  // The row keeps only SHA-256 of the link's random nonce, so a link needs both the secret and the row.
  await qi.createTable('account_tokens', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    purpose: { type: DataTypes.STRING(16), allowNull: false }, // verify | reset | change-email
    email: { type: DataTypes.STRING(254), allowNull: false },
    nonce_hash: { type: DataTypes.CHAR(64), allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('account_tokens', ['user_id', 'purpose']);

  // Account mail sent per address and per client in fixed one-hour windows, counted with an atomic upsert.
  await qi.createTable('account_mail_counts', {
    scope: { type: DataTypes.STRING(16), allowNull: false, primaryKey: true }, // address | client
    subject: { type: DataTypes.STRING(254), allowNull: false, primaryKey: true },
    window_start: { type: DataTypes.DATE, allowNull: false, primaryKey: true },
    count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('account_mail_counts');
  await qi.dropTable('account_tokens');
  await qi.removeColumn('users', 'deleted_at');
  await qi.removeColumn('users', 'session_version');
  await qi.removeColumn('users', 'email_verified_at');
}
