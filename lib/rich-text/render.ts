// Server rendering of a stored entry body: the same schema as the editor, so no HTML written by a user
// ever reaches a page; every tag and attribute comes from the extensions' own renderHTML.
import 'server-only';
import { DOMSerializer } from '@tiptap/pm/model';
import { Window } from 'happy-dom';
import { entrySchema, normalizeToNode, RichTextError } from './normalize';

const UNREADABLE = '<p><em>This entry’s text could not be shown.</em></p>';

// What @tiptap/html's generateHTML does, minus rebuilding the schema and a fresh DOM window on every call
// (about 12 ms each). Serializing is synchronous, so one detached document can serve every request.
let serializer: DOMSerializer | null = null;
let htmlDocument: Document | null = null;
function tools(): { serializer: DOMSerializer; document: Document } {
  serializer ??= DOMSerializer.fromSchema(entrySchema());
  htmlDocument ??= new Window({
    settings: {
      disableJavaScriptEvaluation: true,
      disableJavaScriptFileLoading: true,
      disableCSSFileLoading: true,
      disableIframePageLoading: true,
      disableComputedStyleRendering: true,
    },
  }).document as unknown as Document;
  return { serializer, document: htmlDocument };
}

/**
 * HTML for a body. Cleans it again first, so anything that slipped into storage is still dropped.
 * `allowedImageUrls`: the entry's photos; without it, any http(s) image already stored is kept.
 */
export function renderEntryBody(doc: unknown, opts: { allowedImageUrls?: string[] } = {}): string {
  let node;
  try {
    node = normalizeToNode(doc, opts.allowedImageUrls ? { allowedImageUrls: opts.allowedImageUrls } : { anyHttpImage: true });
  } catch (err) {
    if (err instanceof RichTextError) return UNREADABLE;
    throw err;
  }
  const { serializer, document } = tools();
  const wrap = document.createElement('div');
  serializer.serializeFragment(node.content, { document }, wrap);
  return wrap.innerHTML;
}
