import { QueryTypes, type QueryInterface } from 'sequelize';
import { moveUploadsToAppUrls, moveUploadsToServiceUrls } from '../media-urls';

type Ctx = { context: QueryInterface };

// Uploads become private: pages, bodies and JSON carry the app's own address of each file, which checks
// the viewer and redirects to a short-lived signed URL. One row per stored file (a callback delivered
// twice finds the first row by this key).
export async function up({ context: qi }: Ctx): Promise<void> {
  const sequelize = qi.sequelize;
  const unique = await sequelize.query<{ Key_name: string }>(`SHOW INDEX FROM media WHERE Column_name = 'file_key' AND Non_unique = 0`, { type: QueryTypes.SELECT });
  if (unique.length === 0) await qi.addIndex('media', ['file_key'], { unique: true, name: 'media_file_key_unique' });
  await sequelize.transaction((transaction) => moveUploadsToAppUrls(sequelize, transaction));
}

export async function down({ context: qi }: Ctx): Promise<void> {
  const sequelize = qi.sequelize;
  const base = (process.env.UPLOADTHING_INGEST_URL || 'http://127.0.0.1:3100').replace(/\/$/, '');
  await sequelize.transaction((transaction) => moveUploadsToServiceUrls(sequelize, base, transaction));
}
