import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  // Stored files to remove from the upload service: written in the same transaction that deletes their
  // rows (an entry, a session, a project, a photo), removed once the service confirms the deletion.
  // A process that dies between the commit and the service call leaves the row here for the clean-up.
  await qi.createTable('file_deletions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    file_key: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    last_error: { type: DataTypes.STRING(1000), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('file_deletions', ['next_attempt_at']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('file_deletions');
}
