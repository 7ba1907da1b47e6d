import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import * as m0001 from './migrations/0001-users-projects';
import * as m0002 from './migrations/0002-build-log';
import * as m0003 from './migrations/0003-measurements';
import * as m0004 from './migrations/0004-outbox';
import * as m0005 from './migrations/0005-community';
import * as m0006 from './migrations/0006-calculations';
import * as m0007 from './migrations/0007-accounts';
import * as m0008 from './migrations/0008-sign-in-limits';
import * as m0009 from './migrations/0009-races';
import * as m0010 from './migrations/0010-private-uploads';
import * as m0011 from './migrations/0011-comment-reports';
import * as m0012 from './migrations/0012-file-deletions';
import * as m0013 from './migrations/0013-list-indexes';
import * as m0014 from './migrations/0014-search';
import * as m0015 from './migrations/0015-bench-writes';

// Listed explicitly: no globbing, so a bundler or a renamed file cannot skip or reorder one.
const migrations = [
  { name: '0001-users-projects', ...m0001 },
  { name: '0002-build-log', ...m0002 },
  { name: '0003-measurements', ...m0003 },
  { name: '0004-outbox', ...m0004 },
  { name: '0005-community', ...m0005 },
  { name: '0006-calculations', ...m0006 },
  { name: '0007-accounts', ...m0007 },
  { name: '0008-sign-in-limits', ...m0008 },
  { name: '0009-races', ...m0009 },
  { name: '0010-private-uploads', ...m0010 },
  { name: '0011-comment-reports', ...m0011 },
  { name: '0012-file-deletions', ...m0012 },
  { name: '0013-list-indexes', ...m0013 },
  { name: '0014-search', ...m0014 },
  { name: '0015-bench-writes', ...m0015 },
];

export function createMigrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: migrations.map((m) => ({
      name: m.name,
      up: ({ context }: { context: QueryInterface }) => m.up({ context }),
      down: ({ context }: { context: QueryInterface }) => m.down({ context }),
    })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}
