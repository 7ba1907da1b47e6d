import { describe, expect, test } from 'vitest';
import { BODY_LIMITS, emptyDoc, normalizeEntryBody, RichTextError } from '@/lib/rich-text/normalize';
import { renderEntryBody } from '@/lib/rich-text/render';
import { safeHref } from '@/lib/rich-text/extensions';
import { Window } from 'happy-dom';

// An independent HTML parser reads the output back, as a browser would.
function parse(html: string) {
  const window = new Window();
  window.document.body.innerHTML = html;
  return window.document.body;
}

const PHOTO = '/api/media/41/file';
const opts = { allowedImageUrls: [PHOTO] };

type J = Record<string, unknown>;
const text = (t: string, marks?: J[]): J => (marks ? { type: 'text', text: t, marks } : { type: 'text', text: t });
const p = (...content: J[]): J => (content.length ? { type: 'paragraph', content } : { type: 'paragraph' });
const doc = (...content: J[]): J => ({ type: 'doc', content });
const link = (href: string, label = 'the drawing'): J => p(text(label, [{ type: 'link', attrs: { href } }]));
const linkMarks = (out: J): J[] => JSON.stringify(out).includes('"link"') ? (JSON.parse(JSON.stringify(out)).content[0].content[0].marks ?? []) : [];

// A body using every node and mark the editor offers.
const everything = doc(
  { type: 'heading', attrs: { level: 2 }, content: [text('Boring the register')] },
  { type: 'heading', attrs: { level: 3 }, content: [text('Setup')] },
  { type: 'heading', attrs: { level: 4 }, content: [text('Tool')] },
  p(
    text('Bold ', [{ type: 'bold' }]),
    text('italic ', [{ type: 'italic' }]),
    text('struck ', [{ type: 'strike' }]),
    text('G-code', [{ type: 'code' }]),
    { type: 'hardBreak' },
    text('see the drawing', [{ type: 'link', attrs: { href: 'https://example.test/drawing.pdf' } }]),
  ),
  { type: 'bulletList', content: [{ type: 'listItem', content: [p(text('Face the plate'))] }] },
  { type: 'orderedList', attrs: { start: 3 }, content: [{ type: 'listItem', content: [p(text('Bore to 125 mm'))] }] },
  { type: 'blockquote', content: [p(text('Check the key is out of the chuck.'))] },
  { type: 'codeBlock', attrs: { language: 'gcode' }, content: [text('G0 X0 Z2')] },
  { type: 'horizontalRule' },
  { type: 'image', attrs: { src: PHOTO, alt: 'Spigot after the last pass', width: 1200, height: 800 } },
);

describe('normalizeEntryBody', () => {
  test('keeps a body with every allowed node and mark', () => {
    const out = normalizeEntryBody(everything, opts);
    const types = new Set<string>();
    const marks = new Set<string>();
    const walk = (n: J) => {
      types.add(n.type as string);
      for (const m of (n.marks as J[] | undefined) ?? []) marks.add(m.type as string);
      for (const c of (n.content as J[] | undefined) ?? []) walk(c);
    };
    walk(out);
    expect([...types].sort()).toEqual(
      ['blockquote', 'bulletList', 'codeBlock', 'doc', 'hardBreak', 'heading', 'horizontalRule', 'image', 'listItem', 'orderedList', 'paragraph', 'text'].sort(),
    );
    expect([...marks].sort()).toEqual(['bold', 'code', 'italic', 'link', 'strike']);
    expect(JSON.stringify(out)).toContain('Check the key is out of the chuck.');
    expect(JSON.stringify(out)).toContain(PHOTO);
  });

  test('returns plain objects (a server page can pass them to the editor as props)', () => {
    const out = normalizeEntryBody(everything, opts);
    const protos = new Set<unknown>();
    const walk = (v: unknown) => {
      if (v && typeof v === 'object') {
        protos.add(Object.getPrototypeOf(v));
        Object.values(v).forEach(walk);
      }
    };
    walk(out);
    expect([...protos].every((p) => p === Object.prototype || p === Array.prototype)).toBe(true);
  });

  test('gives an empty document that is itself valid', () => {
    expect(normalizeEntryBody(emptyDoc(), opts)).toEqual({ type: 'doc', content: [{ type: 'paragraph' }] });
  });

  test('a document with no blocks is an empty body', () => {
    expect(normalizeEntryBody({ type: 'doc' }, opts)).toEqual(emptyDoc());
    expect(normalizeEntryBody({ type: 'doc', content: [] }, opts)).toEqual(emptyDoc());
  });

  test('accepts the stored JSON text as well as the object', () => {
    expect(normalizeEntryBody(JSON.stringify(doc(p(text('Facing pass')))), opts)).toEqual(doc(p(text('Facing pass'))));
  });

  test.each([
    ['an unknown node type', doc({ type: 'script', content: [text('alert(1)')] }), /does not support \(“script”/],
    ['an unknown mark', doc(p(text('x', [{ type: 'onclick' }]))), /text style the editor does not support/],
    ['an H1 node type that does not exist', doc({ type: 'iframe' }), /does not support/],
    ['a prototype key as a type', doc({ type: '__proto__' }), /does not support/],
    ['text directly in the document', doc(text('loose text')), /structure is not valid/],
    ['a list item outside a list', doc({ type: 'listItem', content: [p(text('x'))] }), /structure is not valid/],
    ['an empty text node', doc(p({ type: 'text', text: '' })), /has no text/],
    ['content that is not a list', { type: 'doc', content: 'hello' }, /content of the document is not a list/],
    ['a node that is not an object', doc('paragraph' as unknown as J), /is not a node/],
    ['something that is not a document', { type: 'paragraph' }, /must be a document/],
    ['an array', [], /must be a document/],
    ['null', null, /must be a document/],
    ['malformed JSON text', '{"type":"doc",', /not valid JSON/],
  ])('refuses %s with a RichTextError', (_name, input, message) => {
    expect(() => normalizeEntryBody(input, opts)).toThrow(RichTextError);
    expect(() => normalizeEntryBody(input, opts)).toThrow(message);
  });

  // Hostile hrefs: OWASP XSS Filter Evasion Cheat Sheet patterns (scheme case, leading space, embedded tab, data:, vbscript:) — from memory.
  test.each([
    'javascript:alert(1)',
    'JaVaScRiPt:alert(1)',
    '  javascript:alert(1)',
    'java\tscript:alert(1)',
    'java\nscript:alert(1)',
    '\u0000javascript:alert(1)',
    'javascript\u0000:alert(1)',
    '&#106;avascript:alert(1)',
    'jav&#x09;ascript:alert(1)',
    'data:text/html,<script>alert(1)</script>',
    'DATA:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==',
    'vbscript:msgbox(1)',
    'file:///etc/passwd',
    '//evil.test/x',
    '/relative/path',
    'https://',
    'https://exa mple.test/',
  ])('strips the link mark from %j but keeps its text', (href) => {
    const out = normalizeEntryBody(doc(link(href)), opts);
    expect(linkMarks(out)).toEqual([]);
    expect(out).toEqual(doc(p(text('the drawing'))));
  });

  test.each([
    ['https://example.test/drawing.pdf'],
    ['http://example.test/feeds-and-speeds'],
    ['HTTPS://Example.test/Upper'],
    ['mailto:edda@example.test'],
  ])('keeps the link %s and forces a safe rel and no target', (href) => {
    const out = normalizeEntryBody(doc(p(text('the drawing', [{ type: 'link', attrs: { href, target: '_top', class: 'x', rel: 'opener' } }]))), opts);
    expect(linkMarks(out)).toEqual([{ type: 'link', attrs: { href, target: null, rel: 'noopener noreferrer nofollow', class: null, title: null } }]);
  });

  test('drops images that are not the project’s own uploads, data: images included', () => {
    const input = doc(
      p(text('Before')),
      { type: 'image', attrs: { src: 'https://elsewhere.test/tracker.gif' } },
      { type: 'image', attrs: { src: 'data:image/png;base64,iVBORw0KGgo=' } },
      { type: 'image', attrs: { src: 'javascript:alert(1)' } },
      { type: 'image', attrs: { src: null } },
      { type: 'image', attrs: { src: PHOTO, alt: 'Spigot' } },
    );
    const out = normalizeEntryBody(input, opts);
    const images = (out.content as J[]).filter((n) => n.type === 'image');
    expect(images).toEqual([{ type: 'image', attrs: { src: PHOTO, alt: 'Spigot', title: null, width: null, height: null } }]);
  });

  test('an upload service address is dropped even when listed: bodies show photos only through the app’s file route', () => {
    const raw = 'http://127.0.0.1:3100/f/backplate-spigot.jpg';
    const out = normalizeEntryBody(doc({ type: 'image', attrs: { src: raw } }, { type: 'image', attrs: { src: PHOTO } }), { allowedImageUrls: [raw, PHOTO] });
    expect((out.content as J[]).filter((n) => n.type === 'image').map((n) => (n.attrs as J).src)).toEqual([PHOTO]);
  });

  test('a quote left empty by a dropped image still holds a paragraph', () => {
    const out = normalizeEntryBody(doc({ type: 'blockquote', content: [{ type: 'image', attrs: { src: 'https://elsewhere.test/a.jpg' } }] }), opts);
    expect(out).toEqual(doc({ type: 'blockquote', content: [{ type: 'paragraph' }] }));
  });

  test('an H1 becomes the top level allowed (the entry title is the H1)', () => {
    const out = normalizeEntryBody(doc({ type: 'heading', attrs: { level: 1 }, content: [text('Title')] }), opts);
    expect(out).toEqual(doc({ type: 'heading', attrs: { level: 2 }, content: [text('Title')] }));
  });

  test('drops attributes the schema does not know and code-block languages that are not a plain word', () => {
    const out = normalizeEntryBody(
      doc({ type: 'codeBlock', attrs: { language: 'x" onclick="alert(1)', style: 'color:red' }, content: [text('M3 S800')] }),
      opts,
    );
    expect(out).toEqual(doc({ type: 'codeBlock', attrs: { language: null }, content: [text('M3 S800')] }));
  });

  test('refuses a body over the text limit with a message giving the limit', () => {
    const long = 'x'.repeat(1000);
    const paragraphs = Array.from({ length: BODY_LIMITS.textChars / 1000 + 1 }, () => p(text(long)));
    expect(() => normalizeEntryBody(doc(...paragraphs), opts)).toThrow(/too long to save \(31,000 characters; the limit is 30,000\)/);
    // Exactly at the limit is fine.
    expect(() => normalizeEntryBody(doc(...paragraphs.slice(1)), opts)).not.toThrow();
  });

  test('refuses a body over the JSON size limit', () => {
    // Many tiny bold runs: little text, a lot of JSON.
    const runs = Array.from({ length: 6000 }, (_, i) => text(String(i % 10), [{ type: i % 2 ? 'bold' : 'italic' }]));
    expect(() => normalizeEntryBody(doc(p(...runs)), opts)).toThrow(/too large to save \(\d+ KB; the limit is 200 KB\)/);
  });

  test('refuses absurd nesting with a clear message', () => {
    let node: J = p(text('deep'));
    for (let i = 0; i < 40; i++) node = { type: 'blockquote', content: [node] };
    expect(() => normalizeEntryBody(doc(node), opts)).toThrow(/nested too deeply/);
  });
});

describe('safeHref', () => {
  test('trims surrounding spaces of an allowed link', () => {
    expect(safeHref('  https://example.test/a ')).toBe('https://example.test/a');
  });
});

describe('renderEntryBody', () => {
  test('renders headings, lists, quotes, code and images as their own tags', () => {
    const html = renderEntryBody(everything, opts);
    expect(html).toContain('<h2>Boring the register</h2>');
    expect(html).toContain('<h3>Setup</h3>');
    expect(html).toContain('<h4>Tool</h4>');
    expect(html).toContain('<strong>Bold </strong>');
    expect(html).toContain('<em>italic </em>');
    expect(html).toContain('<s>struck </s>');
    expect(html).toContain('<code>G-code</code>');
    expect(html).toContain('<br>');
    expect(html).toMatch(/<ul><li><p>Face the plate<\/p><\/li><\/ul>/);
    expect(html).toMatch(/<ol start="3"><li><p>Bore to 125 mm<\/p><\/li><\/ol>/);
    expect(html).toContain('<blockquote><p>Check the key is out of the chuck.</p></blockquote>');
    expect(html).toContain('<pre><code class="language-gcode">G0 X0 Z2</code></pre>');
    expect(html).toContain('<hr>');
    expect(html).toMatch(/<img [^>]*src="\/api\/media\/41\/file"/);
    expect(html).toMatch(/<img [^>]*loading="lazy"/);
    expect(html).toMatch(/<img [^>]*width="1200"[^>]*height="800"/);
    expect(html).toMatch(/<a [^>]*href="https:\/\/example\.test\/drawing\.pdf"[^>]*>see the drawing<\/a>/);
    expect(html).toMatch(/<a [^>]*rel="noopener noreferrer nofollow"/);
    expect(html).not.toContain('target=');
    expect(html).not.toContain('<h1');
  });

  test('escapes markup typed as text', () => {
    const html = renderEntryBody(doc(p(text('<script>alert(1)</script>')), p(text('<img src=x onerror=alert(1)>'))), opts);
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(html).not.toContain('<script');
    expect(html).not.toContain('<img');
  });

  test('an href with quotes and angle brackets cannot break out of its attribute', () => {
    const html = renderEntryBody(doc(link('https://example.test/"><script>alert(1)</script>')), opts);
    expect(html).not.toContain('<script');
    const body = parse(html);
    expect(body.querySelectorAll('script').length).toBe(0);
    const anchors = body.querySelectorAll('a');
    expect(anchors.length).toBe(1);
    // Percent-encoded as a URL parser would (WHATWG URL Standard, path percent-encode set — from memory).
    expect(anchors[0].getAttribute('href')).toBe('https://example.test/%22%3E%3Cscript%3Ealert(1)%3C/script%3E');
    expect(anchors[0].textContent).toBe('the drawing');
  });

  test('an alt text with a quote stays inside the attribute', () => {
    const html = renderEntryBody(doc({ type: 'image', attrs: { src: PHOTO, alt: '" onerror="alert(1)' } }), opts);
    const img = parse(html).querySelector('img')!;
    expect(img.getAttribute('alt')).toBe('" onerror="alert(1)');
    expect(img.hasAttribute('onerror')).toBe(false);
    expect(img.getAttributeNames().sort()).toEqual(['alt', 'decoding', 'loading', 'src']);
  });

  test('cleans a stored body again: hostile links and foreign images do not render', () => {
    const html = renderEntryBody(
      doc(link('javascript:alert(1)', 'click'), { type: 'image', attrs: { src: 'https://elsewhere.test/t.gif' } }),
      opts,
    );
    expect(html).toBe('<p>click</p>');
  });

  test('without a list of photos, stored http(s) images are kept but data: images are not', () => {
    const html = renderEntryBody(doc({ type: 'image', attrs: { src: PHOTO } }, { type: 'image', attrs: { src: 'data:image/gif;base64,R0lGOD' } }));
    expect(html).toContain(`src="${PHOTO}"`);
    expect(html).not.toContain('data:');
  });

  test('a body that cannot be read renders a plain notice instead of failing the page', () => {
    expect(renderEntryBody('{not json', opts)).toBe('<p><em>This entry’s text could not be shown.</em></p>');
  });
});
