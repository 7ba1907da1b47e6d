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
  // A shop session: one day at the machines.
  await qi.createTable('shop_sessions', {
    id,
    project_id: fk('projects'),
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    title: { type: DataTypes.STRING(120), allowNull: false },
    held_on: { type: DataTypes.DATEONLY, allowNull: false },
    minutes_spent: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    planned: { type: DataTypes.TEXT, allowNull: false },
    done: { type: DataTypes.TEXT, allowNull: false },
    next_steps: { type: DataTypes.TEXT, allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...stamps,
  });
  await qi.addIndex('shop_sessions', ['project_id', 'position']);

  await qi.createTable('entries', {
    id,
    session_id: fk('shop_sessions'),
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    title: { type: DataTypes.STRING(120), allowNull: false },
    operation: { type: DataTypes.STRING(20), allowNull: false },
    // ProseMirror JSON; never HTML.
    body: { type: DataTypes.TEXT('long'), allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...stamps,
  });
  await qi.addIndex('entries', ['session_id', 'position']);

  await qi.createTable('media', {
    id,
    entry_id: fk('entries'),
    kind: { type: DataTypes.STRING(8), allowNull: false }, // photo | clip
    source: { type: DataTypes.STRING(8), allowNull: false }, // upload | link
    file_key: { type: DataTypes.STRING(200), allowNull: true, unique: true },
    url: { type: DataTypes.STRING(2048), allowNull: false },
    name: { type: DataTypes.STRING(255), allowNull: false },
    mime: { type: DataTypes.STRING(100), allowNull: true },
    size_bytes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
    width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    duration_ms: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    uploaded_by: fk('users', true, 'SET NULL'),
    ...stamps,
  });
  await qi.addIndex('media', ['entry_id', 'kind', 'position']);

  // A note pinned to a moment of a clip.
  await qi.createTable('time_notes', {
    id,
    media_id: fk('media'),
    start_ms: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    end_ms: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    kind: { type: DataTypes.STRING(12), allowNull: false }, // note | measurement | caution | question
    text: { type: DataTypes.TEXT, allowNull: false },
    author_id: fk('users', true, 'SET NULL'),
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...stamps,
  });
  await qi.addIndex('time_notes', ['media_id', 'start_ms']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('time_notes');
  await qi.dropTable('media');
  await qi.dropTable('entries');
  await qi.dropTable('shop_sessions');
}
