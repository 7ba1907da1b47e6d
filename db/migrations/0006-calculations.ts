import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  // A calculator's result saved into an entry: its inputs and outputs as structured data, with the
  // version of the tables it was computed from, so it can be reopened and re-checked later.
  await qi.createTable('saved_calculations', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    entry_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'entries', key: 'id' },
      onDelete: 'CASCADE',
    },
    calculator: { type: DataTypes.STRING(24), allowNull: false },
    label: { type: DataTypes.STRING(120), allowNull: false },
    inputs: { type: DataTypes.TEXT, allowNull: false },
    outputs: { type: DataTypes.TEXT('medium'), allowNull: false },
    tables_version: { type: DataTypes.STRING(20), allowNull: false },
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_by_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('saved_calculations', ['entry_id', 'position']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('saved_calculations');
}
