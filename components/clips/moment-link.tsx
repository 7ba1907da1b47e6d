'use client';

import type { MouseEvent, ReactNode } from 'react';
import { useOptionalDiscussion } from '@/components/comments/entry-discussion';

/**
 * A link to a moment of a clip (href from `momentHref`). On the entry page that holds the clip it
 * plays the moment there, switching clips when needed, and keeps the URL in step; anywhere else it navigates.
 */
export function MomentLink({ href, clipId, ms, className, children }: { href: string; clipId: number; ms: number; className?: string; children: ReactNode }) {
  const discussion = useOptionalDiscussion();
  function onClick(e: MouseEvent<HTMLAnchorElement>) {
    if (!discussion || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey || e.button !== 0) return;
    const target = new URL(href, window.location.href);
    if (target.pathname !== window.location.pathname) return;
    if (discussion.seekClip(clipId, ms)) {
      e.preventDefault();
      window.history.replaceState(window.history.state, '', href);
    }
  }
  return (
    <a href={href} onClick={onClick} className={className}>
      {children}
    </a>
  );
}
