// The words of an entry body (ProseMirror JSON) as plain text, for the full-text index (entries.body_text).
// Pure and forgiving: a body that is not valid JSON gives '' rather than failing the save that stores it.

type Node = { type?: unknown; text?: unknown; content?: unknown; attrs?: unknown };

// Nodes that run inline with their neighbours; every other node with content is a block, ended by a line break.
const INLINE = new Set(['text', 'hardBreak', 'image', 'mention']);

function walk(node: Node, out: string[]): void {
  if (!node || typeof node !== 'object') return;
  if (node.type === 'text' && typeof node.text === 'string') {
    out.push(node.text);
    return;
  }
  if (node.type === 'hardBreak') {
    out.push('\n');
    return;
  }
  if (node.type === 'image') {
    // An image's alt text and title are words a reader could look for.
    const attrs = (node.attrs ?? {}) as { alt?: unknown; title?: unknown };
    for (const v of [attrs.alt, attrs.title]) if (typeof v === 'string' && v.trim()) out.push(` ${v} `);
    return;
  }
  if (Array.isArray(node.content)) for (const child of node.content) walk(child as Node, out);
  if (typeof node.type === 'string' && !INLINE.has(node.type) && node.type !== 'doc') out.push('\n');
}

/** Plain text of a stored body (a JSON string or the parsed document): blocks on their own lines, spaces tidied. */
export function entryPlainText(body: string | object | null | undefined): string {
  let doc: unknown = body;
  if (typeof body === 'string') {
    try {
      doc = JSON.parse(body);
    } catch {
      return '';
    }
  }
  const out: string[] = [];
  walk(doc as Node, out);
  return out
    .join('')
    .split('\n')
    .map((line) => line.replace(/[ \t\u00a0]+/g, ' ').trim())
    .filter(Boolean)
    .join('\n');
}
