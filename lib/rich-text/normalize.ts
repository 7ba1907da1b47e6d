// Checks and cleans an entry body (ProseMirror JSON) against the editor's own schema.
// Pure: used on save (the entries routes) and again before every render.
import { getSchema } from '@tiptap/core';
import { Node as PMNode, type Schema } from '@tiptap/pm/model';
import { entryExtensions, HEADING_LEVELS, LINK_REL, safeHref } from './extensions';
import { mediaIdFromFileUrl } from '../media/urls';

/** A body that cannot be stored; the message is written for the person who typed it. */
export class RichTextError extends Error {
  readonly field = 'body';
  constructor(message: string) {
    super(message);
    this.name = 'RichTextError';
  }
}

export const BODY_LIMITS = {
  /** Size of the stored JSON, in bytes of UTF-8. */
  jsonBytes: 200_000,
  /** Characters of text, the measure a writer can see. */
  textChars: 30_000,
  /** Nesting of blocks (quotes in lists in quotes...). */
  depth: 24,
} as const;

type Json = Record<string, unknown>;

let schemaCache: Schema | null = null;
export function entrySchema(): Schema {
  return (schemaCache ??= getSchema(entryExtensions));
}

export function emptyDoc(): Json {
  return { type: 'doc', content: [{ type: 'paragraph' }] };
}

const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const has = (o: object, key: string) => Object.prototype.hasOwnProperty.call(o, key);

/** Which images may stay in a body: the entry's project's own uploads, by their exact app address (`mediaFileUrl`). */
export type ImagePolicy = { allowedImageUrls: string[] } | { anyHttpImage: true };

/**
 * Checks `doc` against the entry schema and returns a cleaned copy: links to anything but http(s)/mailto
 * lose their link, images not among `allowedImageUrls` are removed, attributes are reduced to safe values.
 * Throws RichTextError for anything that is not a body the editor could have produced, or is too large.
 */
export function normalizeEntryBody(doc: unknown, opts: { allowedImageUrls: string[] }): Json {
  // ProseMirror builds attrs with a null prototype; React refuses those as props, so hand back plain JSON.
  return JSON.parse(JSON.stringify(normalizeToNode(doc, opts).toJSON())) as Json;
}

/** The cleaned body as a checked ProseMirror node; the renderer serializes it directly. */
export function normalizeToNode(doc: unknown, policy: ImagePolicy): PMNode {
  const schema = entrySchema();
  const raw = typeof doc === 'string' ? parseJsonText(doc) : doc;
  if (!isObject(raw) || raw.type !== 'doc') throw new RichTextError('The body must be a document from the editor.');
  // A document with nothing in it is simply an empty body.
  const blank = raw.content === undefined || (Array.isArray(raw.content) && raw.content.length === 0);
  const input: Json = blank ? { ...raw, content: emptyDoc().content } : raw;

  let serialized: string;
  try {
    serialized = JSON.stringify(input);
  } catch {
    throw new RichTextError('The body could not be read as a document.');
  }
  const bytes = new TextEncoder().encode(serialized).length;
  if (bytes > BODY_LIMITS.jsonBytes) {
    throw new RichTextError(
      `The body is too large to save (${Math.ceil(bytes / 1000)} KB; the limit is ${BODY_LIMITS.jsonBytes / 1000} KB). Split it into two entries.`,
    );
  }

  const textChars = inspect(input, schema);
  if (textChars > BODY_LIMITS.textChars) {
    throw new RichTextError(
      `The body is too long to save (${textChars.toLocaleString('en')} characters; the limit is ${BODY_LIMITS.textChars.toLocaleString('en')}). Split it into two entries.`,
    );
  }

  const checked = toNode(schema, input).toJSON() as Json;
  const allowed = 'allowedImageUrls' in policy ? new Set(policy.allowedImageUrls) : null;
  // Images are the project's own photos by their app address (/api/media/<id>/file), never the upload
  // service's URL: that one would bypass the viewer check, and a signed one would expire.
  const imageAllowed = (src: string) =>
    allowed ? allowed.has(src) && mediaIdFromFileUrl(src) !== null : mediaIdFromFileUrl(src) !== null || (safeHref(src) !== null && !src.startsWith('mailto:'));
  const cleaned = clean(checked, imageAllowed) ?? emptyDoc();
  // The cleaned copy must still be a valid document (an emptied quote gets a paragraph, for instance).
  return toNode(schema, cleaned);
}

function parseJsonText(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    throw new RichTextError('The body is not valid JSON.');
  }
}

function toNode(schema: Schema, json: Json): PMNode {
  try {
    const node = PMNode.fromJSON(schema, json);
    node.check();
    return node;
  } catch (err) {
    const detail = err instanceof Error ? err.message : String(err);
    throw new RichTextError(`The body's structure is not valid: ${detail}.`);
  }
}

/** Walks the raw JSON before ProseMirror sees it: clear messages for unknown types, bounded depth. Returns the text length. */
function inspect(root: Json, schema: Schema): number {
  let text = 0;
  const walk = (node: unknown, depth: number, path: string) => {
    if (depth > BODY_LIMITS.depth) throw new RichTextError(`The body is nested too deeply (more than ${BODY_LIMITS.depth} levels).`);
    if (!isObject(node)) throw new RichTextError(`The body's structure is not valid: ${path} is not a node.`);
    const type = node.type;
    if (typeof type !== 'string' || !has(schema.nodes, type)) {
      throw new RichTextError(`The body contains something the editor does not support (${describeType(type)} at ${path}).`);
    }
    if (type === 'text') {
      if (typeof node.text !== 'string' || node.text === '') throw new RichTextError(`The body's structure is not valid: ${path} has no text.`);
      text += node.text.length;
    }
    if (node.attrs !== undefined && node.attrs !== null && !isObject(node.attrs)) {
      throw new RichTextError(`The body's structure is not valid: the attributes of ${path} are not an object.`);
    }
    if (node.marks !== undefined) {
      if (!Array.isArray(node.marks)) throw new RichTextError(`The body's structure is not valid: the marks of ${path} are not a list.`);
      for (const mark of node.marks) {
        if (!isObject(mark) || typeof mark.type !== 'string' || !has(schema.marks, mark.type)) {
          throw new RichTextError(`The body contains a text style the editor does not support (${describeType(isObject(mark) ? mark.type : mark)} at ${path}).`);
        }
        if (mark.attrs !== undefined && mark.attrs !== null && !isObject(mark.attrs)) {
          throw new RichTextError(`The body's structure is not valid: a mark's attributes at ${path} are not an object.`);
        }
      }
    }
    if (node.content !== undefined) {
      if (!Array.isArray(node.content)) throw new RichTextError(`The body's structure is not valid: the content of ${path} is not a list.`);
      node.content.forEach((child, i) => walk(child, depth + 1, `${path} › ${type === 'doc' ? 'block' : 'item'} ${i + 1}`));
    }
  };
  walk(root, 0, 'the document');
  return text;
}

function describeType(type: unknown): string {
  if (typeof type === 'string') return `“${type.slice(0, 40)}”`;
  return type === undefined ? 'a node without a type' : 'a node with an invalid type';
}

const LIST_TYPES = new Set(['1', 'a', 'A', 'i', 'I']);
const intIn = (v: unknown, min: number, max: number): number | null =>
  typeof v === 'number' && Number.isInteger(v) && v >= min && v <= max ? v : null;
const shortText = (v: unknown, max: number): string | null => (typeof v === 'string' ? v.slice(0, max) : null);

/** Returns the node with unsafe marks and attributes removed, or null when the node itself must go. */
function clean(node: Json, imageAllowed: (src: string) => boolean): Json | null {
  const type = node.type as string;
  const attrs = isObject(node.attrs) ? node.attrs : {};
  const out: Json = { type };

  switch (type) {
    case 'image': {
      const src = typeof attrs.src === 'string' ? attrs.src.trim() : '';
      if (!src || /^data:/i.test(src) || !imageAllowed(src)) return null;
      out.attrs = {
        src,
        alt: shortText(attrs.alt, 300) ?? '',
        title: shortText(attrs.title, 300),
        width: intIn(attrs.width, 1, 20_000),
        height: intIn(attrs.height, 1, 20_000),
      };
      return out;
    }
    case 'heading': {
      const level = typeof attrs.level === 'number' ? Math.round(attrs.level) : HEADING_LEVELS[0];
      out.attrs = { level: Math.min(Math.max(level, HEADING_LEVELS[0]), HEADING_LEVELS[HEADING_LEVELS.length - 1]) };
      break;
    }
    case 'codeBlock': {
      const lang = typeof attrs.language === 'string' && /^[a-z0-9_+#.-]{1,32}$/i.test(attrs.language) ? attrs.language : null;
      out.attrs = { language: lang };
      break;
    }
    case 'orderedList': {
      out.attrs = { start: intIn(attrs.start, 0, 1_000_000) ?? 1, type: typeof attrs.type === 'string' && LIST_TYPES.has(attrs.type) ? attrs.type : null };
      break;
    }
    case 'text': {
      out.text = node.text;
      break;
    }
    default:
      if (node.attrs !== undefined) out.attrs = node.attrs;
  }

  if (Array.isArray(node.marks)) {
    const marks = (node.marks as Json[]).flatMap((mark): Json[] => {
      if (mark.type !== 'link') return [{ type: mark.type }];
      const markAttrs = isObject(mark.attrs) ? mark.attrs : {};
      const href = safeHref(markAttrs.href);
      if (!href) return [];
      return [{ type: 'link', attrs: { href, target: null, rel: LINK_REL, class: null, title: shortText(markAttrs.title, 300) } }];
    });
    if (marks.length) out.marks = marks;
  }

  if (Array.isArray(node.content)) {
    const children = (node.content as Json[]).map((child) => clean(child, imageAllowed)).filter((c): c is Json => c !== null);
    // A quote or the document left with nothing in it still needs one block.
    if (children.length === 0 && node.content.length > 0 && !entrySchema().nodes[type].isTextblock) children.push({ type: 'paragraph' });
    if (children.length) out.content = children;
  }
  return out;
}
