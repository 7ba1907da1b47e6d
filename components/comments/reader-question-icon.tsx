import { MaskIcon } from '@/components/ui/mask-icon';

/** A speech bubble with a question mark: a reader asking about a moment (drawn by the stylesheet). */
export function ReaderQuestionIcon({ className = 'h-4 w-4' }: { className?: string }) {
  return <MaskIcon name="reader-question" className={className} />;
}
