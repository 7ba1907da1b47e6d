import { deflateRawSync, crc32 } from 'node:zlib';
import yauzl from 'yauzl';

// Reading and writing zips in tests: the archive's files by name, and zips written by hand.

/** The files of a zip, by name. */
export function unzip(buf: Buffer): Promise<Map<string, Buffer>> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(buf, { lazyEntries: true }, (err, z) => {
      if (err) return reject(err);
      const out = new Map<string, Buffer>();
      z!.on('entry', (e: yauzl.Entry) => z!.openReadStream(e, (err2, s) => {
        if (err2) return reject(err2);
        const parts: Buffer[] = [];
        s!.on('data', (c: Buffer) => parts.push(c)).on('end', () => { out.set(e.fileName, Buffer.concat(parts)); z!.readEntry(); });
      }));
      z!.on('end', () => resolve(out));
      z!.readEntry();
    });
  });
}

/** A zip written by hand, so names and sizes can be anything a hostile archive might hold. */
export function rawZip(files: { name: string; data: Buffer; deflate?: boolean; claimSize?: number }[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const f of files) {
    const name = Buffer.from(f.name, 'utf8');
    const packed = f.deflate ? deflateRawSync(f.data) : f.data;
    const size = f.claimSize ?? f.data.length;
    const crc = crc32(f.data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0); local.writeUInt16LE(20, 4); local.writeUInt16LE(0x800, 6); local.writeUInt16LE(f.deflate ? 8 : 0, 8);
    local.writeUInt32LE(crc, 14); local.writeUInt32LE(packed.length, 18); local.writeUInt32LE(size, 22); local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0); central.writeUInt16LE(20, 4); central.writeUInt16LE(20, 6); central.writeUInt16LE(0x800, 8); central.writeUInt16LE(f.deflate ? 8 : 0, 10);
    central.writeUInt32LE(crc, 16); central.writeUInt32LE(packed.length, 20); central.writeUInt32LE(size, 24); central.writeUInt16LE(name.length, 28); central.writeUInt32LE(offset, 42);
    locals.push(local, name, packed);
    centrals.push(central, name);
    offset += local.length + name.length + packed.length;
  }
  const cd = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0); end.writeUInt16LE(files.length, 8); end.writeUInt16LE(files.length, 10); end.writeUInt32LE(cd.length, 12); end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, cd, end]);
}
