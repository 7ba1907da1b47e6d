import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };
const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
const fk = (table: string, allowNull = false, onDelete: 'CASCADE' | 'SET NULL' = 'CASCADE') => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
});

export async function up({ context: qi }: Ctx): Promise<void> {
  // Each session has its own visibility; the project's caps it. announced_at is set once, when the
  // session is first seen published, so followers are told exactly once.
  await qi.addColumn('shop_sessions', 'visibility', { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'private' });
  await qi.addColumn('shop_sessions', 'published_at', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('shop_sessions', 'announced_at', { type: DataTypes.DATE, allowNull: true });
  // Sessions written before visibility existed were shown with their project: keep them so, unannounced.
  await qi.sequelize.query("UPDATE shop_sessions SET visibility = 'published', published_at = created_at, announced_at = created_at");
  await qi.addIndex('shop_sessions', ['visibility', 'published_at']);

  // A member follows a project or a builder (exactly one of the two); mail can be switched off per follow.
  await qi.createTable('follows', {
    id,
    user_id: fk('users'),
    project_id: fk('projects', true),
    builder_id: fk('users', true),
    mail: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...stamps,
  });
  await qi.addIndex('follows', ['user_id', 'project_id'], { unique: true });
  await qi.addIndex('follows', ['user_id', 'builder_id'], { unique: true });
  await qi.addIndex('follows', ['project_id']);
  await qi.addIndex('follows', ['builder_id']);

  // Readers' comments on published entries, optionally pinned to a moment of one of the entry's clips.
  await qi.createTable('comments', {
    id,
    entry_id: fk('entries'),
    author_id: fk('users'),
    parent_id: fk('comments', true),
    media_id: fk('media', true, 'SET NULL'),
    at_ms: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    body: { type: DataTypes.TEXT, allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    edited_at: { type: DataTypes.DATE, allowNull: true },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    hidden_at: { type: DataTypes.DATE, allowNull: true },
    hidden_by_id: fk('users', true, 'SET NULL'),
    hidden_reason: { type: DataTypes.STRING(300), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('comments', ['entry_id', 'created_at']);
  await qi.addIndex('comments', ['author_id', 'created_at']);

  // A builder's invitation to mentor a project. The link carries a signed token; the row makes it single-use.
  await qi.createTable('mentor_invitations', {
    id,
    project_id: fk('projects'),
    email: { type: DataTypes.STRING(254), allowNull: false },
    invited_by_id: fk('users'),
    nonce_hash: { type: DataTypes.CHAR(64), allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_by_id: fk('users', true, 'SET NULL'),
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('mentor_invitations', ['project_id', 'email']);

  // A mentor's risk flag on an entry, a timestamped note or a measurement record.
  await qi.createTable('risk_flags', {
    id,
    project_id: fk('projects'),
    session_id: fk('shop_sessions'),
    entry_id: fk('entries'),
    target_kind: { type: DataTypes.STRING(12), allowNull: false }, // entry | note | measurement
    note_id: fk('time_notes', true),
    record_id: fk('measurement_records', true),
    mentor_id: fk('users'),
    severity: { type: DataTypes.STRING(8), allowNull: false }, // caution | warning | stop
    hazard: { type: DataTypes.STRING(20), allowNull: false },
    concern: { type: DataTypes.TEXT, allowNull: false },
    instead: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'open' }, // open | acknowledged | resolved
    acknowledged_at: { type: DataTypes.DATE, allowNull: true },
    resolved_at: { type: DataTypes.DATE, allowNull: true },
    answer: { type: DataTypes.TEXT, allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...stamps,
  });
  await qi.addIndex('risk_flags', ['project_id', 'status']);
  await qi.addIndex('risk_flags', ['session_id', 'status']);
  await qi.addIndex('risk_flags', ['entry_id']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('risk_flags');
  await qi.dropTable('mentor_invitations');
  await qi.dropTable('comments');
  await qi.dropTable('follows');
  await qi.removeIndex('shop_sessions', ['visibility', 'published_at']);
  await qi.removeColumn('shop_sessions', 'announced_at');
  await qi.removeColumn('shop_sessions', 'published_at');
  await qi.removeColumn('shop_sessions', 'visibility');
}
