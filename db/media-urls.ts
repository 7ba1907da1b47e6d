// Moves stored uploads to the app's own file address (/api/media/<id>/file): media rows and the images
// embedded in entry bodies. Used by migration 0010 and by the demo seeder, whose bodies name the upload
// service's address when they are written. Safe to run again.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

type Json = { [key: string]: unknown };
const appUrl = (id: number) => `/api/media/${id}/file`;

/** The file key an upload-service address names (`…/f/<key>` or `…/a/<appId>/<key>`), or null. */
function keyOf(src: string): string | null {
  try {
    const parts = new URL(src).pathname.split('/').filter(Boolean);
    if (parts.length === 2 && parts[0] === 'f') return decodeURIComponent(parts[1]!);
    if (parts.length === 3 && parts[0] === 'a') return decodeURIComponent(parts[2]!);
  } catch {
    // Not an absolute address: nothing to move.
  }
  return null;
}

function rewriteImages(node: unknown, to: (src: string) => string | null): boolean {
  if (typeof node !== 'object' || node === null) return false;
  const n = node as Json;
  let changed = false;
  if (n.type === 'image' && typeof n.attrs === 'object' && n.attrs !== null) {
    const attrs = n.attrs as Json;
    const next = typeof attrs.src === 'string' ? to(attrs.src) : null;
    if (next && next !== attrs.src) {
      attrs.src = next;
      changed = true;
    }
  }
  if (Array.isArray(n.content)) for (const child of n.content) changed = rewriteImages(child, to) || changed;
  return changed;
}

async function rewriteBodies(sequelize: Sequelize, to: (src: string) => string | null, transaction?: Transaction): Promise<void> {
  const entries = await sequelize.query<{ id: number; body: string }>(`SELECT id, body FROM entries WHERE body LIKE '%"image"%'`, { type: QueryTypes.SELECT, transaction });
  for (const e of entries) {
    let doc: unknown;
    try {
      doc = JSON.parse(e.body);
    } catch {
      continue;
    }
    if (rewriteImages(doc, to)) await sequelize.query('UPDATE entries SET body = ? WHERE id = ?', { replacements: [JSON.stringify(doc), e.id], transaction });
  }
}

export async function moveUploadsToAppUrls(sequelize: Sequelize, transaction?: Transaction): Promise<void> {
  const rows = await sequelize.query<{ id: number; url: string; file_key: string }>(
    `SELECT id, url, file_key FROM media WHERE source = 'upload' AND file_key IS NOT NULL`,
    { type: QueryTypes.SELECT, transaction },
  );
  const byUrl = new Map(rows.map((r) => [r.url, appUrl(r.id)]));
  const byKey = new Map(rows.map((r) => [r.file_key, appUrl(r.id)]));
  await rewriteBodies(sequelize, (src) => byUrl.get(src) ?? byKey.get(keyOf(src) ?? '') ?? null, transaction);
  await sequelize.query(`UPDATE media SET url = CONCAT('/api/media/', id, '/file') WHERE source = 'upload'`, { transaction });
}

/** The way back: the service's public address `<base>/f/<key>`. */
export async function moveUploadsToServiceUrls(sequelize: Sequelize, base: string, transaction?: Transaction): Promise<void> {
  const rows = await sequelize.query<{ id: number; file_key: string }>(`SELECT id, file_key FROM media WHERE source = 'upload' AND file_key IS NOT NULL`, { type: QueryTypes.SELECT, transaction });
  const byApp = new Map(rows.map((r) => [appUrl(r.id), `${base}/f/${encodeURIComponent(r.file_key)}`]));
  await rewriteBodies(sequelize, (src) => byApp.get(src) ?? null, transaction);
  await sequelize.query(`UPDATE media SET url = CONCAT(?, '/f/', file_key) WHERE source = 'upload'`, { replacements: [base], transaction });
}
