import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  // A member's report of a comment to the admins, with their reason. One per member and comment;
  // an admin dismisses it (kept, with who and when) or hides the comment.
  await qi.createTable('comment_reports', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    comment_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'comments', key: 'id' }, onDelete: 'CASCADE' },
    reporter_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    reason: { type: DataTypes.STRING(300), allowNull: false },
    dismissed_at: { type: DataTypes.DATE, allowNull: true },
    dismissed_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('comment_reports', ['comment_id', 'reporter_id'], { unique: true });
  await qi.addIndex('comment_reports', ['dismissed_at', 'created_at']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('comment_reports');
}
