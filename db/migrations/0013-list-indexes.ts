import type { QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// Indexes for the keyset-paged lists (lib/server/keyset.ts): each page is read from where the last one
// ended, in the list's order, so a long list costs per page what a short one does. InnoDB appends the
// primary key to every secondary index, so (…, created_at) also orders ties by id.
const INDEXES: { table: string; fields: string[]; name: string }[] = [
  // An entry's threads, oldest first (top-level comments: parent_id IS NULL).
  { table: 'comments', fields: ['entry_id', 'parent_id', 'created_at'], name: 'comments_entry_parent_created' },
  // The replies of a page's threads.
  { table: 'comments', fields: ['parent_id', 'created_at'], name: 'comments_parent_created' },
  // What a member follows, newest first.
  { table: 'follows', fields: ['user_id', 'created_at'], name: 'follows_user_created' },
  // The admins' accounts list, newest first.
  { table: 'users', fields: ['created_at'], name: 'users_created' },
];

export async function up({ context: qi }: Ctx): Promise<void> {
  for (const i of INDEXES) await qi.addIndex(i.table, i.fields, { name: i.name });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  // comments_parent_created took over from the index MariaDB made for the parent_id foreign key: give the key its own again first.
  await qi.addIndex('comments', ['parent_id'], { name: 'comments_parent_id' });
  for (const i of [...INDEXES].reverse()) await qi.removeIndex(i.table, i.name);
}
