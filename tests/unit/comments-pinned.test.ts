import { describe, expect, test } from 'vitest';
import { pinnedQuestions } from '@/lib/comments/pinned';
import type { CommentView } from '@/lib/types/comments';

const base: CommentView = {
  id: 1, entryId: 9, parentId: null, mediaId: 7, atMs: 5_000, author: { id: 2, name: 'Tobias Quill', role: null },
  state: 'shown', body: 'How was it measured?', hidden: null, version: 1, createdAt: '2026-10-10T10:00:00.000Z', editedAt: null,
  can: { reply: false, edit: false, delete: false, hide: false, unhide: false }, replies: [],
};
const c = (over: Partial<CommentView>): CommentView => ({ ...base, ...over });
const hidden = (textShown: boolean) => ({ by: 'builder' as const, reason: 'Advertising', at: '2026-10-11T10:00:00.000Z', textShown });

describe('pinnedQuestions: which comments join a clip’s notes', () => {
  test('pinned top-level comments in time order; unpinned, replies and other clips stay out', () => {
    const list = [
      c({ id: 1, atMs: 9_000 }),
      c({ id: 2, atMs: 3_000 }),
      c({ id: 3, mediaId: null, atMs: null }),
      c({ id: 4, parentId: 1, atMs: 1_000 }),
      c({ id: 5, mediaId: 8, atMs: 2_000 }),
      c({ id: 6, atMs: 3_000 }),
    ];
    expect(pinnedQuestions(list, 7).map((q) => q.id)).toEqual([2, 6, 1]);
    expect(pinnedQuestions(list).map((q) => q.id)).toEqual([5, 2, 6, 1]);
  });

  test('removed ones never; hidden ones only for viewers who may still read the text', () => {
    const list = [c({ id: 1, state: 'removed', body: '' }), c({ id: 2, state: 'hidden', body: '', hidden: hidden(false) }), c({ id: 3, state: 'hidden', hidden: hidden(true) })];
    expect(pinnedQuestions(list, 7).map((q) => q.id)).toEqual([3]);
  });
});
