import { appendFileSync } from 'node:fs';
import { Sequelize } from 'sequelize';
import * as mariadb from 'mariadb';
import { env } from '../lib/env';

// One pool per process: Next's dev server reloads modules, so the instance lives on globalThis.
const globalForDb = globalThis as unknown as { scribelineSequelize?: Sequelize };

// Opt-in, for the page benchmark: SCRIBELINE_SQL_LOG=<file> appends one line per query to that file.
function sqlLogger(): false | ((sql: string) => void) {
  const file = process.env.SCRIBELINE_SQL_LOG;
  if (!file) return false;
  return (sql) => appendFileSync(file, sql.replace(/\s+/g, ' ').slice(0, 500) + '\n');
}

export function getSequelize(): Sequelize {
  if (!globalForDb.scribelineSequelize) {
    const e = env();
    globalForDb.scribelineSequelize = new Sequelize(e.DB_NAME, e.DB_USER, e.DB_PASSWORD, {
      host: e.DB_HOST,
      port: e.DB_PORT,
      dialect: 'mariadb',
      dialectModule: mariadb,
      logging: sqlLogger(),
      pool: { max: e.DB_POOL_MAX, min: 0, idle: 10_000 },
      dialectOptions: { connectTimeout: 5_000 },
      define: { underscored: true },
    });
  }
  return globalForDb.scribelineSequelize;
}

export async function closeSequelize(): Promise<void> {
  const s = globalForDb.scribelineSequelize;
  globalForDb.scribelineSequelize = undefined;
  if (s) await s.close();
}
