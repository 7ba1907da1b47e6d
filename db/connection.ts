import { Sequelize } from 'sequelize';
import * as mariadb from 'mariadb';
import { env } from '../lib/env';

// One pool per process: Next's dev server reloads modules, so the instance lives on globalThis.
const globalForDb = globalThis as unknown as { scribelineSequelize?: Sequelize };

export function getSequelize(): Sequelize {
  if (!globalForDb.scribelineSequelize) {
    const e = env();
    globalForDb.scribelineSequelize = new Sequelize(e.DB_NAME, e.DB_USER, e.DB_PASSWORD, {
      host: e.DB_HOST,
      port: e.DB_PORT,
      dialect: 'mariadb',
      dialectModule: mariadb,
      logging: false,
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
