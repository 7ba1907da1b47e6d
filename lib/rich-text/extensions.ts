// The one list of extensions behind an entry body: the editor, the checks on save and the server
// renderer all build their schema from it, so what can be typed is exactly what can be stored and shown.
// No React here: server code imports it too.
import type { Extensions } from '@tiptap/core';
import StarterKit from '@tiptap/starter-kit';
import Image from '@tiptap/extension-image';

export const LINK_PROTOCOLS = ['http:', 'https:', 'mailto:'] as const;

export const HEADING_LEVELS = [2, 3, 4] as const;

// Characters a browser ignores or strips inside a URL scheme ("java\tscript:", NUL, BOM...):
// their presence anywhere in an href is reason enough to refuse it.
// eslint-disable-next-line no-control-regex
const SUSPICIOUS_CHARS = /[\u0000-\u001f\u007f-\u009f\u00ad\u200b-\u200f\u2028\u2029\u2060\ufeff]/;

/**
 * The link target if it is an absolute http(s) or mailto URL, else null. Relative links, other schemes
 * and anything disguised with whitespace, control characters or HTML entities are refused.
 */
export function safeHref(value: unknown): string | null {
  if (typeof value !== 'string') return null;
  const href = value.trim();
  if (!href || href.length > 2048 || SUSPICIOUS_CHARS.test(href) || /\s/.test(href)) return null;
  // The scheme must be spelled out plainly at the start: "&#106;avascript:" or "jav&#x09;ascript:" fail here.
  const scheme = /^([a-z][a-z0-9+.-]*):/i.exec(href)?.[1]?.toLowerCase();
  if (!scheme || !(LINK_PROTOCOLS as readonly string[]).includes(`${scheme}:`)) return null;
  let url: URL;
  try {
    url = new URL(href);
  } catch {
    return null;
  }
  if (!(LINK_PROTOCOLS as readonly string[]).includes(url.protocol)) return null;
  if (url.protocol !== 'mailto:' && !url.hostname) return null;
  // Characters a URL never carries raw; encoding them changes nothing for the browser and keeps markup out of the attribute.
  return href.replace(/["<>`]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

export const LINK_REL = 'noopener noreferrer nofollow';

// Markdown-style "![alt](src)" typed in the editor would pull in a picture from anywhere:
// photos come only from the entry's own uploads, through the picker.
const EntryImage = Image.extend({
  addInputRules() {
    return [];
  },
});

export const entryExtensions: Extensions = [
  StarterKit.configure({
    // The entry title is the page's H1.
    heading: { levels: [...HEADING_LEVELS] },
    // Underlined text reads as a link on the page.
    underline: false,
    link: {
      openOnClick: false,
      autolink: true,
      defaultProtocol: 'https',
      HTMLAttributes: { rel: LINK_REL, target: null, class: null },
      isAllowedUri: (url) => safeHref(url) !== null,
      shouldAutoLink: (url) => safeHref(/^[a-z][a-z0-9+.-]*:/i.test(url) ? url : `https://${url}`) !== null,
    },
  }),
  EntryImage.configure({
    inline: false,
    allowBase64: false,
    HTMLAttributes: { loading: 'lazy', decoding: 'async' },
  }),
];
