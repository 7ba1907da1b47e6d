import { randomUUID } from 'node:crypto';
import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';

/**
 * On-disk layout under dataDir:
 *   files/<key>        the bytes
 *   files/<key>.json   the sidecar (StoredFile)
 *   tmp/<key>.<uuid>.part  bodies still being received
 * A file exists for readers only when both the bytes and the sidecar exist.
 */

export type FileStatus = 'Uploading' | 'Uploaded';

export interface StoredFile {
  id: string;
  key: string;
  name: string;
  size: number;
  type: string;
  customId: string | null;
  uploadedAt: number;
  /** sha256 of the bytes, hex. */
  fileHash: string;
  /** 'Uploading' while the app's upload-complete callback is still pending. */
  status: FileStatus;
  contentDisposition: string;
  acl: string | null;
}

const KEY_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]{0,254}$/;
const META_SUFFIX = '.json';
const TEMP_SUFFIX = '.part';

export function isValidKey(key: string): boolean {
  return KEY_PATTERN.test(key) && !key.endsWith(META_SUFFIX) && !key.includes('..');
}

function isMissing(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { code?: unknown }).code === 'ENOENT';
}

export class FileStore {
  readonly filesDir: string;
  readonly tmpDir: string;

  constructor(readonly dataDir: string) {
    this.filesDir = path.join(dataDir, 'files');
    this.tmpDir = path.join(dataDir, 'tmp');
  }

  async init(): Promise<void> {
    await mkdir(this.filesDir, { recursive: true });
    await mkdir(this.tmpDir, { recursive: true });
  }

  dataPath(key: string): string {
    if (!isValidKey(key)) throw new Error(`invalid file key: ${key}`);
    return path.join(this.filesDir, key);
  }

  private metaPath(key: string): string {
    return this.dataPath(key) + META_SUFFIX;
  }

  newTempPath(key: string): string {
    if (!isValidKey(key)) throw new Error(`invalid file key: ${key}`);
    return path.join(this.tmpDir, `${key}.${randomUUID()}${TEMP_SUFFIX}`);
  }

  /** Writes through a temp file so a reader never sees half a sidecar. */
  private async writeMeta(meta: StoredFile): Promise<void> {
    const tmp = path.join(this.tmpDir, `${meta.key}.${randomUUID()}.meta${TEMP_SUFFIX}`);
    try {
      await writeFile(tmp, JSON.stringify(meta, null, 2));
      await rename(tmp, this.metaPath(meta.key));
    } finally {
      await rm(tmp, { force: true });
    }
  }

  /** Moves a fully received temp file into place, bytes first then sidecar. */
  async commit(tempPath: string, meta: StoredFile): Promise<void> {
    await rename(tempPath, this.dataPath(meta.key));
    try {
      await this.writeMeta(meta);
    } catch (err) {
      await rm(this.dataPath(meta.key), { force: true });
      throw err;
    }
  }

  async read(key: string): Promise<StoredFile | null> {
    if (!isValidKey(key)) return null;
    try {
      const meta = JSON.parse(await readFile(this.metaPath(key), 'utf8')) as StoredFile;
      await stat(this.dataPath(key));
      return meta;
    } catch (err) {
      if (isMissing(err) || err instanceof SyntaxError) return null;
      throw err;
    }
  }

  async update(key: string, patch: Partial<Omit<StoredFile, 'key' | 'id'>>): Promise<StoredFile | null> {
    const current = await this.read(key);
    if (!current) return null;
    const next = { ...current, ...patch };
    await this.writeMeta(next);
    return next;
  }

  /** Removes the sidecar first so the file disappears for readers at once. */
  async remove(key: string): Promise<boolean> {
    if (!isValidKey(key)) return false;
    const existed = (await this.read(key)) !== null;
    await rm(this.metaPath(key), { force: true });
    await rm(this.dataPath(key), { force: true });
    return existed;
  }

  async list(): Promise<StoredFile[]> {
    let names: string[];
    try {
      names = await readdir(this.filesDir);
    } catch (err) {
      if (isMissing(err)) return [];
      throw err;
    }
    const files: StoredFile[] = [];
    for (const name of names) {
      if (!name.endsWith(META_SUFFIX)) continue;
      const meta = await this.read(name.slice(0, -META_SUFFIX.length));
      if (meta) files.push(meta);
    }
    return files.sort((a, b) => a.uploadedAt - b.uploadedAt || a.key.localeCompare(b.key));
  }

  async findByCustomId(customId: string): Promise<StoredFile | null> {
    return (await this.list()).find((f) => f.customId === customId) ?? null;
  }

  /**
   * Removes what an upload that never completed left behind: temp bodies,
   * files stuck in 'Uploading', and halves of a commit interrupted by a
   * crash. Anything touched within `olderThanMs`, or named in `activeKeys`
   * (uploads in flight in this process), is left alone.
   */
  async sweep(olderThanMs: number, activeKeys: ReadonlySet<string> = new Set()): Promise<string[]> {
    const cutoff = Date.now() - olderThanMs;
    const removed: string[] = [];
    const isOld = async (file: string): Promise<boolean> => {
      try {
        return (await stat(file)).mtimeMs <= cutoff;
      } catch (err) {
        if (isMissing(err)) return false;
        throw err;
      }
    };
    const isActiveTemp = (name: string): boolean => [...activeKeys].some((key) => name.startsWith(`${key}.`));

    for (const name of await readdir(this.tmpDir).catch(() => [] as string[])) {
      const file = path.join(this.tmpDir, name);
      if (isActiveTemp(name)) continue;
      if (await isOld(file)) {
        await rm(file, { force: true });
        removed.push(file);
      }
    }

    const names = new Set(await readdir(this.filesDir).catch(() => [] as string[]));
    for (const name of names) {
      const isMeta = name.endsWith(META_SUFFIX);
      const key = isMeta ? name.slice(0, -META_SUFFIX.length) : name;
      if (!isValidKey(key) || activeKeys.has(key)) continue;
      const file = path.join(this.filesDir, name);
      const partner = isMeta ? key : key + META_SUFFIX;
      let abandoned = !names.has(partner);
      if (!abandoned && isMeta) {
        const meta = await this.read(key);
        abandoned = meta?.status === 'Uploading';
      }
      if (abandoned && (await isOld(file))) {
        await rm(file, { force: true });
        removed.push(file);
        if (names.has(partner)) {
          await rm(path.join(this.filesDir, partner), { force: true });
          removed.push(path.join(this.filesDir, partner));
          names.delete(partner);
        }
      }
    }
    return removed;
  }
}
