// An entry body (ProseMirror JSON of our extension list) as Markdown (CommonMark), for the project archive.
type Node = { type?: string; text?: string; attrs?: Record<string, unknown>; marks?: { type?: string; attrs?: Record<string, unknown> }[]; content?: Node[] };

const escapeText = (t: string) => t.replace(/([\\`*_[\]<>#|])/g, '\\$1');

function inline(nodes: Node[] = []): string {
  return nodes
    .map((n) => {
      if (n.type === 'hardBreak') return '  \n';
      if (n.type === 'image') return image(n);
      if (n.type !== 'text') return inline(n.content);
      const marks = n.marks ?? [];
      const isCode = marks.some((m) => m.type === 'code');
      let out = isCode ? `\`${(n.text ?? '').replace(/`/g, "'")}\`` : escapeText(n.text ?? '');
      for (const m of marks) {
        if (m.type === 'bold') out = `**${out}**`;
        else if (m.type === 'italic') out = `*${out}*`;
        else if (m.type === 'strike') out = `~~${out}~~`;
        else if (m.type === 'link' && typeof m.attrs?.href === 'string') out = `[${out}](<${m.attrs.href.replace(/[<>\s]/g, encodeURIComponent)}>)`;
      }
      return out;
    })
    .join('');
}

function image(n: Node): string {
  const alt = typeof n.attrs?.alt === 'string' ? n.attrs.alt : '';
  const src = typeof n.attrs?.src === 'string' ? n.attrs.src : '';
  return `![${escapeText(alt)}](<${src.replace(/[<>\s]/g, encodeURIComponent)}>)`;
}

const indent = (text: string, by: string) => text.split('\n').map((l, i) => (i === 0 || l === '' ? l : by + l)).join('\n');

function block(n: Node): string {
  switch (n.type) {
    case 'paragraph': return inline(n.content);
    case 'heading': return `${'#'.repeat(Number(n.attrs?.level) || 2)} ${inline(n.content)}`;
    case 'blockquote': return blocks(n.content).split('\n').map((l) => (l ? `> ${l}` : '>')).join('\n');
    case 'codeBlock': return `\`\`\`\`\n${(n.content ?? []).map((c) => c.text ?? '').join('')}\n\`\`\`\``;
    case 'horizontalRule': return '---';
    case 'image': return image(n);
    case 'bulletList': return (n.content ?? []).map((li) => `- ${indent(blocks(li.content), '  ')}`).join('\n');
    case 'orderedList': {
      const start = Number(n.attrs?.start) || 1;
      return (n.content ?? []).map((li, i) => `${start + i}. ${indent(blocks(li.content), '   ')}`).join('\n');
    }
    default: return n.content ? blocks(n.content) : inline([n]);
  }
}

function blocks(nodes: Node[] = []): string {
  return nodes.map(block).join('\n\n');
}

/** The body as Markdown; image sources as they stand in the body (the archive rewrites them first). */
export function entryMarkdown(doc: unknown): string {
  const root = (doc && typeof doc === 'object' ? doc : {}) as Node;
  return blocks(root.content).trim() + '\n';
}
