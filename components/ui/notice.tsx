import type { ReactNode } from 'react';

type Kind = 'info' | 'error' | 'success' | 'caution';
const styles: Record<Kind, { box: string; icon: string; label: string }> = {
  info: { box: 'border-dye/40 bg-dye-soft', icon: 'ℹ', label: 'Note' },
  error: { box: 'border-bad/50 bg-bad-soft text-bad', icon: '✕', label: 'Problem' },
  success: { box: 'border-ok/50 bg-ok-soft text-ok', icon: '✓', label: 'Done' },
  caution: { box: 'border-scribe/60 bg-scribe-soft', icon: '⚠', label: 'Caution' },
};

/** A message said in words with an icon, never by colour alone. */
export function Notice({ kind = 'info', title, children, role }: { kind?: Kind; title?: string; children: ReactNode; role?: 'status' | 'alert' }) {
  const s = styles[kind];
  return (
    <div role={role} className={`flex gap-3 rounded-md border px-4 py-3 text-sm ${s.box}`} data-notice={kind}>
      <span aria-hidden="true" className="text-base leading-5">
        {s.icon}
      </span>
      <div>
        <p className="font-semibold">{title ?? s.label}</p>
        <div className="mt-0.5">{children}</div>
      </div>
    </div>
  );
}
