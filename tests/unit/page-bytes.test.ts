// The page cache hands a cached page's HTML to Next as bytes (encoded once per stored page), never as a string that
// Next would encode again for every answer. The bytes must be the page's UTF-8 exactly (UTF-8: RFC 3629), and
// everything that is not a page must pass through untouched.
import * as fs from 'node:fs';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { pageValueAsBytes, withPageBytes } from '@/lib/cache-handlers/page-bytes.mjs';
import RouteCacheLocal from '@/lib/cache-handlers/route-cache-local.mjs';

// Text a page really holds beyond ASCII: an en dash, a tick, a diameter sign, a micrometre.
const HTML = '<!DOCTYPE html><p>Bore 25 H7 – checked ✓ ⌀ 24.993 µm</p>';
const page = (html: string) => ({ kind: 'APP_PAGE', html, rscData: Buffer.from('0:{}'), headers: { 'x-next-cache-tags': 'log:1' }, postponed: undefined, status: 200, segmentData: undefined });

describe('a cached page as bytes', () => {
  it('hands back the HTML as its UTF-8 bytes, the rest of the entry as it was', () => {
    const entry = { value: page(HTML), lastModified: 1, cacheControl: { revalidate: 60, expire: 600 } };
    const out = withPageBytes(entry)!;
    const html = out.value!.html as Buffer;
    expect(Buffer.isBuffer(html)).toBe(true);
    expect(html.equals(Buffer.from(HTML, 'utf8'))).toBe(true);
    expect(html.toString('utf8')).toBe(HTML);
    expect(out.value!.rscData).toBe(entry.value.rscData);
    expect(out.value!.headers).toBe(entry.value.headers);
    expect(out.cacheControl).toBe(entry.cacheControl);
    // The stored entry keeps its string: other readers of the same entry (a revalidation) see what Next stored.
    expect(entry.value.html).toBe(HTML);
  });

  it('encodes a stored page once, however often it is read', () => {
    const entry = { value: page(HTML), lastModified: 1 };
    const bytes = () => withPageBytes(entry)!.value!.html;
    expect(Buffer.isBuffer(bytes())).toBe(true);
    expect(bytes()).toBe(bytes());
    // Another stored page (after a write expired the first) is encoded afresh.
    expect(String(withPageBytes({ value: page(`${HTML}!`), lastModified: 2 })!.value!.html)).toBe(`${HTML}!`);
  });

  it('leaves a miss, a route answer, a data entry and a page already in bytes alone', () => {
    expect(withPageBytes(null)).toBeNull();
    for (const value of [
      { kind: 'APP_ROUTE', body: Buffer.from('{}'), status: 200, headers: {} },
      { kind: 'FETCH', data: { body: 'x' } },
      { ...page(''), html: Buffer.from(HTML) },
    ]) {
      const entry = { value, lastModified: 1 };
      expect(withPageBytes(entry)).toBe(entry);
    }
  });

  it('stores a page for the shared cache with its HTML as bytes', () => {
    const stored = pageValueAsBytes(page(HTML))!;
    expect(Buffer.isBuffer(stored.html)).toBe(true);
    expect(String(stored.html)).toBe(HTML);
    const route = { kind: 'APP_ROUTE', body: Buffer.from('{}'), status: 200, headers: {} };
    expect(pageValueAsBytes(route)).toBe(route);
  });
});

describe("the one-server page cache (Next's own file-system cache)", () => {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'scribeline-page-cache-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('stores what Next gives it and reads a page back as bytes', async () => {
    const nodeFs = {
      existsSync: fs.existsSync,
      readFile: (f: string, enc?: BufferEncoding) => fs.promises.readFile(f, enc as BufferEncoding),
      readFileSync: (f: string, enc?: BufferEncoding) => fs.readFileSync(f, enc as BufferEncoding),
      writeFile: (f: string, d: string | Buffer) => fs.promises.writeFile(f, d),
      mkdir: (d: string) => fs.promises.mkdir(d, { recursive: true }),
      stat: (f: string) => fs.promises.stat(f),
    };
    const cache = new RouteCacheLocal({ fs: nodeFs, dev: false, flushToDisk: false, serverDistDir: dir, revalidatedTags: [], maxMemoryCacheSize: 1024 * 1024 });
    await cache.set('/logs/a-log/entries/1', page(HTML), { cacheControl: { revalidate: 60, expire: 600 } });
    const read = await cache.get('/logs/a-log/entries/1', { kind: 'APP_PAGE', isRoutePPREnabled: true, tags: [], softTags: [] });
    expect(read?.value?.kind).toBe('APP_PAGE');
    expect(Buffer.isBuffer(read.value.html)).toBe(true);
    expect(read.value.html.toString('utf8')).toBe(HTML);
    expect(await cache.get('/logs/a-log/entries/2', { kind: 'APP_PAGE', isRoutePPREnabled: true, tags: [], softTags: [] })).toBeNull();
  });
});
