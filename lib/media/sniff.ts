// Tells what a file is from its first bytes, never from its name or its declared type.
// Pure: the uploader runs it in the browser before sending, the server again on the stored bytes.

export type PhotoMime = 'image/jpeg' | 'image/png' | 'image/gif' | 'image/webp';
export type ClipMime = 'video/mp4' | 'video/quicktime' | 'video/webm' | 'video/x-matroska';

export type Sniffed =
  | { kind: 'photo'; mime: PhotoMime; label: string }
  | { kind: 'clip'; mime: ClipMime; label: string }
  /** Recognised, but not something we keep (a HEIC photo, an AVI, an audio file...). */
  | { kind: 'other'; mime: string; label: string };

/** Enough for every signature here, including an EBML header's DocType. */
export const SNIFF_BYTES = 4096;

const ascii = (b: Uint8Array, from: number, length: number): string => {
  let s = '';
  for (let i = from; i < from + length && i < b.length; i++) s += String.fromCharCode(b[i]);
  return s;
};

const startsWith = (b: Uint8Array, sig: readonly number[], at = 0): boolean =>
  b.length >= at + sig.length && sig.every((v, i) => b[at + i] === v);

// ISO base media "ftyp" major brands that are not video we keep.
const HEIF_BRANDS = new Set(['heic', 'heix', 'hevc', 'hevx', 'heim', 'heis', 'mif1', 'msf1']);
const AVIF_BRANDS = new Set(['avif', 'avis']);
const CLASSIC_QT_ATOMS = new Set(['moov', 'mdat', 'wide', 'free']);
const AUDIO_BRANDS = new Set(['M4A ', 'M4B ', 'M4P ', 'F4A ', 'F4B ']);

/** Reads the DocType of an EBML header ("webm" or "matroska"), or null if it is not found in the bytes given. */
function ebmlDocType(b: Uint8Array): string | null {
  // DocType element id 0x4282, then a one-byte size (0x80 | n) in every writer met in practice.
  for (let i = 4; i + 3 < b.length && i < 64; i++) {
    if (b[i] === 0x42 && b[i + 1] === 0x82 && (b[i + 2] & 0x80) === 0x80) {
      const n = b[i + 2] & 0x7f;
      return ascii(b, i + 3, n).replace(/\0+$/, '');
    }
  }
  return null;
}

/** What an empty file (0 bytes) is sniffed as, so its refusal can say so. */
const EMPTY: Sniffed = { kind: 'other', mime: 'application/x-empty', label: 'empty file' };

export function sniffMedia(bytes: Uint8Array): Sniffed | null {
  const b = bytes;
  if (b.length === 0) return EMPTY;
  if (startsWith(b, [0xff, 0xd8, 0xff])) return { kind: 'photo', mime: 'image/jpeg', label: 'JPEG' };
  if (startsWith(b, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { kind: 'photo', mime: 'image/png', label: 'PNG' };
  const six = ascii(b, 0, 6);
  if (six === 'GIF87a' || six === 'GIF89a') return { kind: 'photo', mime: 'image/gif', label: 'GIF' };
  if (ascii(b, 0, 4) === 'RIFF' && b.length >= 12) {
    const form = ascii(b, 8, 4);
    if (form === 'WEBP') return { kind: 'photo', mime: 'image/webp', label: 'WebP' };
    if (form === 'AVI ') return { kind: 'other', mime: 'video/x-msvideo', label: 'AVI video' };
    if (form === 'WAVE') return { kind: 'other', mime: 'audio/wav', label: 'WAV audio' };
    return null;
  }
  if (b.length >= 12 && ascii(b, 4, 4) === 'ftyp') {
    const brand = ascii(b, 8, 4);
    if (brand === 'qt  ') return { kind: 'clip', mime: 'video/quicktime', label: 'MOV' };
    if (HEIF_BRANDS.has(brand)) return { kind: 'other', mime: 'image/heic', label: 'HEIC photo' };
    if (AVIF_BRANDS.has(brand)) return { kind: 'other', mime: 'image/avif', label: 'AVIF photo' };
    if (AUDIO_BRANDS.has(brand)) return { kind: 'other', mime: 'audio/mp4', label: 'audio file' };
    return { kind: 'clip', mime: 'video/mp4', label: 'MP4' };
  }
  // Older QuickTime files open with one of these atoms instead of "ftyp".
  if (b.length >= 8 && CLASSIC_QT_ATOMS.has(ascii(b, 4, 4))) return { kind: 'clip', mime: 'video/quicktime', label: 'MOV' };
  if (startsWith(b, [0x1a, 0x45, 0xdf, 0xa3])) {
    const docType = ebmlDocType(b);
    return docType === 'matroska'
      ? { kind: 'clip', mime: 'video/x-matroska', label: 'Matroska' }
      : { kind: 'clip', mime: 'video/webm', label: 'WebM' };
  }
  if (startsWith(b, [0x42, 0x4d]) && b.length >= 14) return { kind: 'other', mime: 'image/bmp', label: 'BMP image' };
  if (startsWith(b, [0x49, 0x49, 0x2a, 0x00]) || startsWith(b, [0x4d, 0x4d, 0x00, 0x2a])) return { kind: 'other', mime: 'image/tiff', label: 'TIFF image' };
  if (startsWith(b, [0x25, 0x50, 0x44, 0x46])) return { kind: 'other', mime: 'application/pdf', label: 'PDF document' };
  return null;
}

/**
 * Why a file cannot be kept as the given kind, in words for the person who chose it; null when it can.
 * `name` only makes the message recognisable: the verdict comes from the bytes.
 */
export function contentRefusal(sniffed: Sniffed | null, kind: 'photo' | 'clip', name: string): string | null {
  const wanted = kind === 'photo' ? 'a JPEG, PNG, WebP or GIF photo' : 'an MP4, MOV or WebM clip';
  if (!sniffed) return `“${name}” is not ${wanted}: its content is not a picture or video format we recognise.`;
  if (sniffed.mime === EMPTY.mime) return `“${name}” is empty (0 bytes): nothing was saved in it. Choose the file again once it has been written, e.g. after the camera or phone has finished copying it.`;
  if (sniffed.kind === kind) return null;
  if (sniffed.kind === 'other') return `“${name}” is a ${sniffed.label}; add ${wanted} instead.`;
  return kind === 'photo'
    ? `“${name}” is a video (${sniffed.label}), not a photo: add it as a clip.`
    : `“${name}” is a photo (${sniffed.label}), not a video: add it as a photo.`;
}
