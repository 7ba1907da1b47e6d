import { linkify } from '@/lib/rich-text/linkify';

/**
 * A comment's plain text: text nodes and http(s) links only, never markup from the text itself.
 * Newlines are kept by the white-space rule.
 */
export function CommentText({ text, className = '' }: { text: string; className?: string }) {
  return (
    <p className={`whitespace-pre-wrap break-words [overflow-wrap:anywhere] ${className}`}>
      {linkify(text).map((part, i) =>
        part.kind === 'link' ? (
          <a key={i} href={part.href} rel="nofollow ugc noopener noreferrer" target="_blank">
            {part.text}
            <span className="sr-only"> (opens a new tab)</span>
          </a>
        ) : (
          part.text
        ),
      )}
    </p>
  );
}
