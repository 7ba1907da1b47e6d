'use client';

import dynamic from 'next/dynamic';

// The comment forms and their validation (react-hook-form, zod) load when a form is shown: a signed-out
// reader of an entry, most of its readers, never loads them.
function Loading() {
  return (
    <p role="status" className="text-sm text-graphite-2">
      Loading the form…
    </p>
  );
}

export const CommentForm = dynamic(() => import('./comment-form').then((m) => m.CommentForm), { loading: Loading });
export const ReportCommentForm = dynamic(() => import('./report-comment').then((m) => m.ReportCommentForm), { loading: Loading });
export const HideCommentForm = dynamic(() => import('./hide-comment-form').then((m) => m.HideCommentForm), { loading: Loading });
