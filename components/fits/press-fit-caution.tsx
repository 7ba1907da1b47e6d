import type { FitKind } from '@/lib/fits';
import { Notice } from '@/components/ui/notice';

/** Shown with every interference or transition fit: pressing and shrinking parts can hurt. */
export function PressFitCaution({ kind }: { kind: Exclude<FitKind, 'clearance'> }) {
  return (
    <Notice kind="caution" title={kind === 'interference' ? 'Caution: pressing or shrinking parts together' : 'Caution: this fit may need a press'}>
      <ul className="list-disc space-y-1 pl-4">
        <li>A pressed part stores force: it can crack, shear or fly out without warning. Wear eye protection and keep hands clear of the ram.</li>
        <li>Use a proper press and arbor with the part supported squarely. Never hammer hardened parts such as bearings or pins: they can shatter.</li>
        <li>A heated hub or chilled shaft burns: handle it with tongs or insulated gloves, away from oil and solvents.</li>
      </ul>
      <p className="mt-2">Follow your press and heater manuals, local rules and qualified practice; if it is new to you, ask someone who has done it.</p>
    </Notice>
  );
}
