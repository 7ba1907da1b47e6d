// The project archive's format (version 1): what the zip holds, the manifest and data shapes that import
// checks, the caps that keep a hostile archive out, and the one check of a path inside the zip.
// Pure: no database, no upload service (export.ts and import.ts do the work).
import { z } from 'zod';
import { NOTE_KIND_OPTIONS, OPERATIONS } from '../../validations/log';

export const ARCHIVE_FORMAT = 'scribeline-archive';
export const ARCHIVE_VERSION = 1;
export const MANIFEST_PATH = 'scribeline-archive.json';
export const DATA_PROJECT_PATH = 'data/project.json';
export const DATA_PAIRS_PATH = 'data/pairs.json';
export const sessionDataPath = (n: number) => `data/sessions/${String(n).padStart(4, '0')}.json`;

const MiB = 1024 * 1024;
/**
 * What import accepts. Counted while streaming (the upload, every entry's bytes), not taken from the
 * zip's own headers alone, so a zip that lies about its sizes is caught too.
 */
export const ARCHIVE_LIMITS = {
  /** The uploaded zip itself. */
  uploadBytes: 4 * 1024 * MiB,
  /** Every entry, uncompressed, added up. */
  totalBytes: 6 * 1024 * MiB,
  entries: 20_000,
  /** One data file (project.json, a session's file, pairs.json), uncompressed. */
  dataFileBytes: 32 * MiB,
  /** The manifest, uncompressed. */
  manifestBytes: 8 * MiB,
  /** Uncompressed over compressed, for an entry of more than a mebibyte: text compresses maybe 10:1, a bomb 1000:1. */
  ratio: 200,
  ratioFloorBytes: 1 * MiB,
  pathLength: 240,
} as const;

/** Why a path inside the zip may not be used, or null when it is a plain relative path inside the folder. */
export function unsafePathReason(name: string): string | null {
  if (name.length === 0) return 'an empty name';
  if (name.length > ARCHIVE_LIMITS.pathLength) return `a name longer than ${ARCHIVE_LIMITS.pathLength} characters`;
  if (name.includes('\\')) return 'a backslash';
  if ([...name].some((c) => c.charCodeAt(0) < 0x20 || c.charCodeAt(0) === 0x7f)) return 'a control character';
  if (name.startsWith('/') || /^[A-Za-z]:/.test(name)) return 'an absolute path';
  const parts = name.replace(/\/$/, '').split('/');
  if (parts.some((p) => p === '..')) return 'a "../" that climbs out of the folder';
  if (parts.some((p) => p === '' || p === '.')) return 'an empty or "." path segment';
  return null;
}

const sha256Hex = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 in hex');
const count = z.number().int().min(0);

export const manifestSchema = z.object({
  format: z.literal(ARCHIVE_FORMAT, { error: `format must be "${ARCHIVE_FORMAT}"` }),
  version: z.number({ error: 'version must be a number' }).int(),
  createdAt: z.string(),
  project: z.object({ title: z.string().max(200), slug: z.string().max(200) }),
  counts: z.object({
    sessions: count, entries: count, media: count, notes: count, records: count, readings: count, pairs: count, calculations: count,
  }),
  files: z.array(z.object({ path: z.string().max(ARCHIVE_LIMITS.pathLength), bytes: count, sha256: sha256Hex })).max(ARCHIVE_LIMITS.entries),
});
export type Manifest = z.infer<typeof manifestSchema>;
export type ManifestCounts = Manifest['counts'];

const ref = z.string().regex(/^[a-z]\d{1,12}$/, 'a reference such as "m12"');
const text = (max: number) => z.string().max(max);
const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/);
const decimalText = z.string().regex(/^-?\d{1,12}(\.\d{1,12})?$/, 'a decimal number');

export const archiveNoteSchema = z.object({
  ref,
  startMs: z.number().int().min(0),
  endMs: z.number().int().min(0).nullable(),
  kind: z.enum(NOTE_KIND_OPTIONS.map((o) => o.value) as [string, ...string[]]),
  text: text(4000),
});

export const archiveMediaSchema = z.object({
  ref,
  kind: z.enum(['photo', 'clip']),
  source: z.enum(['upload', 'link']),
  /** The file inside the archive (uploads), or null for a link to a clip elsewhere. */
  file: z.string().max(ARCHIVE_LIMITS.pathLength).nullable(),
  /** For links: the clip's address; for uploads: ignored (the import makes its own). */
  url: text(2048),
  name: text(255),
  mime: text(100).nullable(),
  sizeBytes: z.number().int().min(0).nullable(),
  width: z.number().int().min(0).nullable(),
  height: z.number().int().min(0).nullable(),
  durationMs: z.number().int().min(0).nullable(),
  caption: text(500),
  position: z.number().int().min(0),
  notes: z.array(archiveNoteSchema).max(5000),
});

export const archiveReadingSchema = z.object({
  position: z.number().int().min(0),
  passNumber: z.number().int().nullable(),
  value: decimalText,
  unit: z.enum(['mm', 'in']),
  instrument: text(40),
  resolution: decimalText,
  measuredBy: text(120),
  measuredAt: z.iso.datetime({ offset: true }),
  temperatureC: decimalText.nullable(),
  note: text(1000),
});

export const archiveRecordSchema = z.object({
  ref,
  noteRef: ref.nullable(),
  feature: text(120),
  kind: z.enum(['outside', 'inside']),
  nominal: decimalText,
  unit: z.enum(['mm', 'in']),
  specType: z.enum(['zone', 'inchClass', 'limits', 'plusMinus', 'general']),
  specZone: text(20).nullable(),
  specUpper: decimalText.nullable(),
  specLower: decimalText.nullable(),
  specTolerance: decimalText.nullable(),
  specGeneralClass: text(10).nullable(),
  readings: z.array(archiveReadingSchema).max(100),
});

export const archiveCalculationSchema = z.object({
  calculator: text(40),
  label: text(200),
  inputs: z.unknown(),
  outputs: z.unknown(),
  tablesVersion: text(20),
  position: z.number().int().min(0),
});

export const archiveEntrySchema = z.object({
  ref,
  position: z.number().int().min(0),
  title: text(200),
  operation: z.enum(OPERATIONS.map((o) => o.value) as [string, ...string[]]),
  body: z.unknown(),
  media: z.array(archiveMediaSchema).max(500),
  records: z.array(archiveRecordSchema).max(2000),
  calculations: z.array(archiveCalculationSchema).max(500),
});

export const archiveSessionSchema = z.object({
  ref,
  position: z.number().int().min(0),
  title: text(200),
  heldOn: day,
  minutesSpent: z.number().int().min(0).max(100_000),
  planned: text(20_000),
  done: text(20_000),
  nextSteps: text(20_000),
  entries: z.array(archiveEntrySchema).max(2000),
});
export type ArchiveSession = z.infer<typeof archiveSessionSchema>;
export type ArchiveEntry = z.infer<typeof archiveEntrySchema>;
export type ArchiveMedia = z.infer<typeof archiveMediaSchema>;

export const archiveProjectSchema = z.object({
  title: text(200),
  summary: text(20_000),
  units: z.enum(['mm', 'in']),
  /** The session data files, in order. */
  sessions: z.array(z.string().max(ARCHIVE_LIMITS.pathLength)).max(5000),
});
export type ArchiveProject = z.infer<typeof archiveProjectSchema>;

export const archivePairsSchema = z.array(z.object({ hole: ref, shaft: ref })).max(20_000);
