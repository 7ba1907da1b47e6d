import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/** Renumbers `position` 0..n-1 within each parent, keeping the present order (ties by id). */
function renumber(table: string, parent: string): string {
  return `UPDATE ${table} t JOIN (
      SELECT id, ROW_NUMBER() OVER (PARTITION BY ${parent} ORDER BY position, id) - 1 AS n FROM ${table}
    ) r ON r.id = t.id
    SET t.position = r.n
    WHERE t.position <> r.n`;
}

export async function up({ context: qi }: Ctx): Promise<void> {
  // Parallel creates could give several rows the same position: put every list back to 0..n-1 first.
  await qi.sequelize.query(renumber('shop_sessions', 'project_id'));
  await qi.sequelize.query(renumber('entries', 'session_id'));
  await qi.sequelize.query(renumber('saved_calculations', 'entry_id'));

  // Saved calculations are only ever appended (never moved), so their position can be unique per entry.
  // Sessions and entries are renumbered one row at a time when moved, so they rely on the parent's row lock.
  await qi.addIndex('saved_calculations', ['entry_id', 'position'], { unique: true, name: 'saved_calculations_entry_position' });
  await qi.removeIndex('saved_calculations', 'saved_calculations_entry_id_position');

  // A client-made id for "create this project": the same submit sent twice gives the same project.
  // The hash of what was asked tells a repeat from a different request that reuses the id.
  await qi.addColumn('projects', 'create_request_id', { type: DataTypes.STRING(100), allowNull: true });
  await qi.addColumn('projects', 'create_request_hash', { type: DataTypes.CHAR(64), allowNull: true });
  await qi.addIndex('projects', ['owner_id', 'create_request_id'], { unique: true, name: 'projects_owner_create_request' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeIndex('projects', 'projects_owner_create_request');
  await qi.removeColumn('projects', 'create_request_hash');
  await qi.removeColumn('projects', 'create_request_id');
  await qi.addIndex('saved_calculations', ['entry_id', 'position'], { name: 'saved_calculations_entry_id_position' });
  await qi.removeIndex('saved_calculations', 'saved_calculations_entry_position');
}
