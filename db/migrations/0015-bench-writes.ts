import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// Writes made on the bench view may be sent more than once (queued on the phone while offline, sent again
// after a lost answer). Each carries an id the phone made (a UUID); it is kept with a unique key, so a second
// delivery finds the first row instead of making another.
const clientId = { type: DataTypes.STRING(64), allowNull: true };

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('measurement_readings', 'client_id', clientId);
  await qi.addIndex('measurement_readings', ['client_id'], { unique: true, name: 'measurement_readings_client_id' });
  await qi.addColumn('media', 'client_id', clientId);
  await qi.addIndex('media', ['client_id'], { unique: true, name: 'media_client_id' });
  // Additions to a session that leave no row of their own (a line of "what got done", minutes on the timer):
  // the ledger of those already applied.
  await qi.createTable('session_writes', {
    client_id: { type: DataTypes.STRING(64), allowNull: false, primaryKey: true },
    session_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'shop_sessions', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.STRING(8), allowNull: false }, // note | time
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('session_writes', ['session_id']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('session_writes');
  await qi.removeIndex('media', 'media_client_id');
  await qi.removeColumn('media', 'client_id');
  await qi.removeIndex('measurement_readings', 'measurement_readings_client_id');
  await qi.removeColumn('measurement_readings', 'client_id');
}
