import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };
const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(80), allowNull: false },
    handle: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    site_role: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'member' },
    ...stamps,
  });
  await qi.createTable('projects', {
    id,
    owner_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    slug: { type: DataTypes.STRING(90), allowNull: false, unique: true },
    title: { type: DataTypes.STRING(120), allowNull: false },
    summary: { type: DataTypes.TEXT, allowNull: false },
    units: { type: DataTypes.STRING(2), allowNull: false, defaultValue: 'mm' },
    visibility: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'private' },
    published_at: { type: DataTypes.DATE, allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...stamps,
  });
  await qi.addIndex('projects', ['owner_id', 'updated_at']);
  await qi.addIndex('projects', ['visibility', 'published_at']);
  await qi.createTable('project_memberships', {
    id,
    project_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'projects', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    role: { type: DataTypes.STRING(16), allowNull: false },
    ...stamps,
  });
  await qi.addIndex('project_memberships', ['project_id', 'user_id'], { unique: true });
  await qi.addIndex('project_memberships', ['user_id']);
  await qi.createTable('auth_sign_in_attempts', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    scope: { type: DataTypes.STRING(16), allowNull: false },
    subject: { type: DataTypes.STRING(254), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('auth_sign_in_attempts', ['scope', 'subject', 'created_at']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('auth_sign_in_attempts');
  await qi.dropTable('project_memberships');
  await qi.dropTable('projects');
  await qi.dropTable('users');
}
