/** The icons the stylesheet draws (app/globals.css, `.icon-*`): one short element per row instead of an inline <svg>. */
export type MaskIconName =
  | 'note-note'
  | 'note-measurement'
  | 'note-caution'
  | 'note-question'
  | 'reader-question'
  | 'feature-outside'
  | 'feature-inside';

/** A decorative icon in the text colour; `className` sizes it (h-4 w-4). Always beside words that say the same. */
export function MaskIcon({ name, className }: { name: MaskIconName; className: string }) {
  return <span aria-hidden="true" className={`icon icon-${name} ${className}`} />;
}
