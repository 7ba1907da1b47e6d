import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { contentRefusal, sniffMedia } from '@/lib/media/sniff';
import { displaySize, durationRefusal, formatBytes, formatDuration, PHOTO_MAX_BYTES, CLIP_MAX_BYTES, sizeRefusal } from '@/lib/media/rules';

const fixture = (name: string) => new Uint8Array(readFileSync(path.join(__dirname, '..', 'fixtures', 'media', name)));
const bytes = (...parts: Array<number[] | string>) =>
  new Uint8Array(parts.flatMap((p) => (typeof p === 'string' ? [...p].map((c) => c.charCodeAt(0)) : p)));
const u32be = (n: number) => [(n >>> 24) & 0xff, (n >>> 16) & 0xff, (n >>> 8) & 0xff, n & 0xff];

describe('sniffMedia: signatures built from the published formats', () => {
  test.each([
    // JPEG SOI marker FF D8 followed by a marker's FF (ITU-T T.81 — from memory)
    ['JPEG/JFIF', bytes([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10], 'JFIF', [0]), 'photo', 'image/jpeg'],
    ['JPEG/Exif', bytes([0xff, 0xd8, 0xff, 0xe1, 0x00, 0x10], 'Exif', [0, 0]), 'photo', 'image/jpeg'],
    // PNG signature 89 50 4E 47 0D 0A 1A 0A (ISO/IEC 15948, 5.2 — from memory)
    ['PNG', bytes([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13], 'IHDR'), 'photo', 'image/png'],
    // GIF header "GIF87a" / "GIF89a" (GIF89a specification, section 17 — from memory)
    ['GIF87a', bytes('GIF87a', [1, 0, 1, 0]), 'photo', 'image/gif'],
    ['GIF89a', bytes('GIF89a', [1, 0, 1, 0]), 'photo', 'image/gif'],
    // WebP: a RIFF container whose form type is "WEBP" (RFC 9649, section 2.5 — from memory)
    ['WebP', bytes('RIFF', [0x1e, 0, 0, 0], 'WEBPVP8L'), 'photo', 'image/webp'],
    // ISO base media file: box size, then "ftyp", then the major brand (ISO/IEC 14496-12, 4.3 — from memory)
    ['MP4 isom', bytes(u32be(32), 'ftypisom', [0, 0, 2, 0]), 'clip', 'video/mp4'],
    ['MP4 mp42', bytes(u32be(24), 'ftypmp42', [0, 0, 0, 0]), 'clip', 'video/mp4'],
    // QuickTime brand "qt  " (QuickTime File Format, File Type Compatibility Atom — from memory)
    ['MOV', bytes(u32be(20), 'ftypqt  ', [0, 0, 2, 0]), 'clip', 'video/quicktime'],
    ['MOV without ftyp', bytes(u32be(8), 'wide', u32be(100), 'mdat'), 'clip', 'video/quicktime'],
    // EBML magic 1A 45 DF A3 with DocType "webm" (RFC 8794 / WebM container guidelines — from memory)
    ['WebM', bytes([0x1a, 0x45, 0xdf, 0xa3, 0x9f, 0x42, 0x86, 0x81, 0x01, 0x42, 0x82, 0x84], 'webm'), 'clip', 'video/webm'],
    ['Matroska', bytes([0x1a, 0x45, 0xdf, 0xa3, 0xa3, 0x42, 0x86, 0x81, 0x01, 0x42, 0x82, 0x88], 'matroska'), 'clip', 'video/x-matroska'],
  ])('%s', (_name, input, kind, mime) => {
    expect(sniffMedia(input)).toMatchObject({ kind, mime });
  });

  test.each([
    // HEIF brands "heic"/"mif1" (ISO/IEC 23008-12 — from memory): an iPhone photo, not a clip
    ['HEIC', bytes(u32be(24), 'ftypheic', [0, 0, 0, 0]), 'image/heic'],
    ['AVIF', bytes(u32be(24), 'ftypavif', [0, 0, 0, 0]), 'image/avif'],
    ['M4A audio', bytes(u32be(24), 'ftypM4A ', [0, 0, 0, 0]), 'audio/mp4'],
    // AVI and WAV are RIFF forms too (Microsoft RIFF specification — from memory)
    ['AVI', bytes('RIFF', [0, 0, 0, 0], 'AVI LIST'), 'video/x-msvideo'],
    ['PDF', bytes('%PDF-1.7'), 'application/pdf'],
  ])('%s is recognised but not kept', (_name, input, mime) => {
    expect(sniffMedia(input)).toMatchObject({ kind: 'other', mime });
  });

  test.each([
    ['plain text', bytes('Spindle runout 0.01 mm at the nose')],
    ['JPEG cut short', bytes([0xff, 0xd8])],
    ['RIFF with an unknown form', bytes('RIFF', [0, 0, 0, 0], 'ABCD')],
    ['"GIF" without a version', bytes('GIF8')],
  ])('%s is not recognised', (_name, input) => {
    expect(sniffMedia(input)).toBeNull();
  });
});

describe('sniffMedia on small real files made with ImageMagick and ffmpeg', () => {
  test.each([
    ['scribe-4x3.png', 'photo', 'image/png'],
    ['dye-2x2.jpg', 'photo', 'image/jpeg'],
    ['rotated-4x2-orient6.jpg', 'photo', 'image/jpeg'],
    ['tiny-3x5.gif', 'photo', 'image/gif'],
    ['tiny-6x4.webp', 'photo', 'image/webp'],
    ['tiny-1s.mp4', 'clip', 'video/mp4'],
    ['tiny-1s.mov', 'clip', 'video/quicktime'],
    ['tiny-1s.webm', 'clip', 'video/webm'],
  ])('%s', (name, kind, mime) => {
    expect(sniffMedia(fixture(name))).toMatchObject({ kind, mime });
  });
});

describe('contentRefusal', () => {
  test('a photo passes as a photo, not as a clip', () => {
    const png = sniffMedia(fixture('scribe-4x3.png'));
    expect(contentRefusal(png, 'photo', 'a.png')).toBeNull();
    expect(contentRefusal(png, 'clip', 'a.png')).toMatch(/is a photo \(PNG\), not a video/);
  });
  test('text named .jpg is refused by its content', () => {
    expect(contentRefusal(sniffMedia(bytes('hello')), 'photo', 'chuck.jpg')).toMatch(/“chuck\.jpg” is not a JPEG, PNG, WebP or GIF photo/);
  });
  test('an empty file is called empty, not an unknown format', () => {
    expect(sniffMedia(new Uint8Array(0))).toMatchObject({ kind: 'other', mime: 'application/x-empty' });
    const said = contentRefusal(sniffMedia(new Uint8Array(0)), 'clip', 'spigot.mp4');
    expect(said).toMatch(/“spigot\.mp4” is empty \(0 bytes\)/);
    expect(said).not.toMatch(/recognise/);
  });
  test('a HEIC photo names its format', () => {
    expect(contentRefusal(sniffMedia(bytes(u32be(24), 'ftypheic', [0, 0, 0, 0])), 'photo', 'IMG.HEIC')).toMatch(/HEIC photo/);
  });
});

describe('limits and plausibility', () => {
  test('20 MB for photos and 2 GB for clips, counted in powers of 1024 as the upload SDK does', () => {
    expect(PHOTO_MAX_BYTES).toBe(20_971_520);
    expect(CLIP_MAX_BYTES).toBe(2_147_483_648);
    expect(sizeRefusal('photo', 'p.jpg', 20_971_520)).toBeNull();
    expect(sizeRefusal('photo', 'p.jpg', 20_971_521)).toMatch(/is 20971521 bytes; a photo can be at most 20971520 bytes/);
    expect(sizeRefusal('photo', 'p.jpg', 25 * 1024 * 1024)).toMatch(/is 25 MB; a photo can be at most 20 MB/);
    expect(sizeRefusal('clip', 'c.mp4', 2.5 * 1024 * 1024 * 1024)).toMatch(/is 2\.5 GB; a clip can be at most 2 GB/);
  });

  test.each([
    // bits per second = bytes × 8 / seconds (common practice)
    ['1 s, 10 KB → 80 kbit/s', 10_000, 1_000, null],
    ['60 s, 1 KB → 133 bit/s: too little for video', 1_000, 60_000, /which no video can be/],
    ['1 s, 100 MB → 800 Mbit/s: more than any camera records', 100_000_000, 1_000, /which no video can be/],
    ['10 min, 200 MB → 2.7 Mbit/s', 200_000_000, 600_000, null],
    ['zero length', 10_000, 0, /positive time/],
    ['negative length', 10_000, -5, /positive time/],
    ['12 hours', 10_000_000_000, 12 * 3600 * 1000, /shorter than 12 hours/],
  ])('%s', (_name, size, ms, expected) => {
    const r = durationRefusal('clip.mp4', size, ms);
    if (expected === null) expect(r).toBeNull();
    else expect(r).toMatch(expected);
  });

  test('EXIF orientations 5–8 swap width and height (Exif 2.3, tag 0x0112 — from memory)', () => {
    expect(displaySize(4, 2, 1)).toEqual({ width: 4, height: 2 });
    expect(displaySize(4, 2, 3)).toEqual({ width: 4, height: 2 });
    expect(displaySize(4, 2, 6)).toEqual({ width: 2, height: 4 });
    expect(displaySize(4, 2, 8)).toEqual({ width: 2, height: 4 });
    expect(displaySize(4, 2)).toEqual({ width: 4, height: 2 });
  });

  test('formats', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(1536)).toBe('1.5 KB');
    expect(formatBytes(21 * 1024 * 1024)).toBe('21 MB');
    expect(formatBytes(2 * 1024 * 1024 * 1024)).toBe('2 GB');
    expect(formatBytes(2.5 * 1024 * 1024 * 1024)).toBe('2.5 GB');
    expect(formatDuration(61_000)).toBe('1:01');
    expect(formatDuration(3_723_000)).toBe('1:02:03');
  });
});
