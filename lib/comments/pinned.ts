// Which comments show among a clip's timestamped notes: pure, used by pages and components alike.
import type { CommentView } from '../types/comments';

/**
 * Top-level comments pinned to a moment of a clip whose text this viewer can read, in time order.
 * A hidden one stays in the list only for those who may still read it (marked there as hidden).
 */
export function pinnedQuestions(comments: readonly CommentView[], mediaId?: number): CommentView[] {
  return comments
    .filter((c) => c.parentId == null && c.mediaId != null && c.atMs != null)
    .filter((c) => mediaId === undefined || c.mediaId === mediaId)
    .filter((c) => c.state === 'shown' || (c.state === 'hidden' && c.hidden?.textShown))
    .sort((a, b) => a.atMs! - b.atMs! || a.id - b.id);
}
