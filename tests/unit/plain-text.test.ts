import { describe, expect, test } from 'vitest';
import { entryPlainText } from '@/lib/rich-text/plain-text';

// The words kept beside an entry body for the full-text index. Expected texts are written out by hand
// from the ProseMirror JSON document model (prosemirror.net "Document structure" — common practice:
// blocks are separate lines, marks add no text).
const p = (...content: unknown[]) => ({ type: 'paragraph', content });
const t = (text: string, marks?: unknown[]) => ({ type: 'text', text, ...(marks ? { marks } : {}) });

describe('entryPlainText', () => {
  test.each([
    ['one paragraph', { type: 'doc', content: [p(t('Bored the register'))] }, 'Bored the register'],
    ['marks add nothing', { type: 'doc', content: [p(t('Spigot '), t('130 k6', [{ type: 'bold' }]), t(' to size'))] }, 'Spigot 130 k6 to size'],
    ['blocks on their own lines', { type: 'doc', content: [{ type: 'heading', attrs: { level: 2 }, content: [t('Boring')] }, p(t('Slow feed.'))] }, 'Boring\nSlow feed.'],
    ['list items apart', { type: 'doc', content: [{ type: 'bulletList', content: [{ type: 'listItem', content: [p(t('Face'))] }, { type: 'listItem', content: [p(t('Turn'))] }] }] }, 'Face\nTurn'],
    ['a hard break is a line', { type: 'doc', content: [p(t('line one'), { type: 'hardBreak' }, t('line two'))] }, 'line one\nline two'],
    ['an image gives its alt text', { type: 'doc', content: [p(t('See')), { type: 'image', attrs: { src: '/api/media/1/file', alt: 'cast iron blank' } }] }, 'See\ncast iron blank'],
    ['an empty document', { type: 'doc', content: [{ type: 'paragraph' }] }, ''],
  ])('%s', (_name, doc, expected) => {
    expect(entryPlainText(doc)).toBe(expected);
    expect(entryPlainText(JSON.stringify(doc))).toBe(expected);
  });

  test('text that is not JSON gives nothing instead of failing the save', () => {
    expect(entryPlainText('{not json')).toBe('');
    expect(entryPlainText(null)).toBe('');
  });
});
