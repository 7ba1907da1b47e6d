import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';
import { entryPlainText } from '../../lib/rich-text/plain-text';

type Ctx = { context: QueryInterface };

// Search (lib/server/search.ts) reads InnoDB FULLTEXT indexes. Entry bodies are ProseMirror JSON, so their
// words are kept beside it as plain text (entries.body_text), written by the Entry model on every body save
// and filled here for the entries that exist.
const INDEXES: { table: string; fields: string[]; name: string }[] = [
  { table: 'shop_sessions', fields: ['title', 'planned', 'done', 'next_steps'], name: 'shop_sessions_search' },
  { table: 'entries', fields: ['title', 'body_text'], name: 'entries_search' },
  { table: 'time_notes', fields: ['text'], name: 'time_notes_search' },
  { table: 'comments', fields: ['body'], name: 'comments_search' },
  { table: 'measurement_records', fields: ['feature', 'spec_zone'], name: 'measurement_records_search' },
];

const BATCH = 500;

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('entries', 'body_text', { type: DataTypes.TEXT('medium'), allowNull: false, defaultValue: '' });
  let after = 0;
  for (;;) {
    const rows = await qi.sequelize.query<{ id: number; body: string }>('SELECT id, body FROM entries WHERE id > ? ORDER BY id LIMIT ?', {
      replacements: [after, BATCH],
      type: QueryTypes.SELECT,
    });
    if (!rows.length) break;
    for (const r of rows) {
      const text = entryPlainText(r.body);
      if (text) await qi.sequelize.query('UPDATE entries SET body_text = ? WHERE id = ?', { replacements: [text, r.id] });
    }
    after = rows[rows.length - 1]!.id;
  }
  // One ALTER per index: InnoDB builds one FULLTEXT index at a time.
  for (const i of INDEXES) await qi.addIndex(i.table, i.fields, { name: i.name, type: 'FULLTEXT' });
  // The fit filter: records by zone, then nominal size.
  await qi.addIndex('measurement_records', ['spec_type', 'spec_zone', 'nominal'], { name: 'measurement_records_zone_nominal' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  // Plain ALTERs: the query interface's removeColumn reads the table first through a raw query the connector refuses.
  await qi.sequelize.query('ALTER TABLE measurement_records DROP INDEX measurement_records_zone_nominal');
  for (const i of [...INDEXES].reverse()) await qi.sequelize.query(`ALTER TABLE ${i.table} DROP INDEX ${i.name}`);
  await qi.sequelize.query('ALTER TABLE entries DROP COLUMN body_text');
}
