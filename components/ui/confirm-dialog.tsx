'use client';

import { useId, useRef, useState, type ReactNode } from 'react';
import { Button } from './button';

type Props = {
  /** What the trigger button says, e.g. "Delete". */
  trigger: ReactNode;
  triggerLabel?: string;
  title: string;
  body: ReactNode;
  confirmLabel: string;
  onConfirm: () => Promise<string | null>;
  small?: boolean;
};

/** Asks before something that cannot be undone; shows why it failed, if it did. Escape closes it. */
export function ConfirmDialog({ trigger, triggerLabel, title, body, confirmLabel, onConfirm, small }: Props) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  // Two dialogs can share a title (a table and its phone cards): the id must not come from it.
  const titleId = useId();

  async function confirm() {
    setBusy(true);
    setError(null);
    const failure = await onConfirm();
    setBusy(false);
    if (failure) setError(failure);
    else dialog.current?.close();
  }

  return (
    <>
      <Button type="button" tone="danger" aria-label={triggerLabel} className={small ? '!min-h-10 !px-3' : ''} onClick={() => dialog.current?.showModal()}>
        {trigger}
      </Button>
      <dialog ref={dialog} aria-labelledby={titleId} className="m-auto max-w-md rounded-lg border border-rule bg-card p-6 text-graphite backdrop:bg-black/50">
        <h2 id={titleId} className="text-lg font-bold">
          {title}
        </h2>
        <div className="mt-2 text-sm text-graphite-2">{body}</div>
        {error ? (
          <p className="mt-2 text-sm font-semibold text-bad" role="alert">
            ✕ {error}
          </p>
        ) : null}
        <div className="mt-5 flex flex-wrap justify-end gap-2">
          <Button type="button" tone="quiet" onClick={() => dialog.current?.close()} autoFocus>
            Keep it
          </Button>
          <Button type="button" tone="danger" onClick={confirm} disabled={busy}>
            {busy ? 'Working…' : confirmLabel}
          </Button>
        </div>
      </dialog>
    </>
  );
}
