import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  // E-mail waiting to go out. The action that causes a message writes its row in the same
  // transaction; a worker sends it later and retries, so a mail outage never fails the action.
  await qi.createTable('outbox_messages', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    kind: { type: DataTypes.STRING(40), allowNull: false }, // session-published | flag-answered | mentor-invite
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(200), allowNull: false },
    text_body: { type: DataTypes.TEXT('medium'), allowNull: false },
    html_body: { type: DataTypes.TEXT('medium'), allowNull: true },
    // Lets a caller say "at most one such message", e.g. session-published:<sessionId>:<userId>.
    dedupe_key: { type: DataTypes.STRING(191), allowNull: true, unique: true },
    status: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'pending' }, // pending | sent | failed
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    // When a pending row may next be tried; while a worker holds it, the end of its lease.
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    claim_token: { type: DataTypes.CHAR(32), allowNull: true },
    last_error: { type: DataTypes.STRING(1000), allowNull: true },
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('outbox_messages', ['status', 'next_attempt_at'], { name: 'outbox_messages_due' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('outbox_messages');
}
