import type { CapturedMailView } from '@/lib/types/mail';

function formatTime(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'medium' });
}

/** One caught e-mail: headers, the plain-text body as text, and the HTML part only inside a locked-down frame. */
export function CapturedMessage({ message }: { message: CapturedMailView }) {
  const headingId = `mail-${message.id}`;
  return (
    <article aria-labelledby={headingId} className="rounded-lg border border-rule bg-card p-4 sm:p-5" data-testid="captured-message">
      <h2 id={headingId} className="text-lg font-bold break-words">
        {message.subject || '(no subject)'}
      </h2>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="text-graphite-2">To</dt>
        <dd className="break-all">{message.to}</dd>
        <dt className="text-graphite-2">From</dt>
        <dd className="break-all">{message.from}</dd>
        <dt className="text-graphite-2">Received</dt>
        <dd>
          <time dateTime={message.receivedAt} className="dim">
            {formatTime(message.receivedAt)}
          </time>
        </dd>
        {message.kind ? (
          <>
            <dt className="text-graphite-2">Kind</dt>
            <dd className="dim">{message.kind}</dd>
          </>
        ) : null}
      </dl>
      <pre className="mt-3 max-h-96 overflow-auto whitespace-pre-wrap break-words rounded-md border border-rule bg-paper-2 p-3 font-sans text-sm">
        {message.text || '(no plain-text part)'}
      </pre>
      {message.html ? (
        <details className="mt-3">
          <summary className="inline-flex min-h-11 cursor-pointer items-center text-sm font-semibold text-dye">Show the HTML version</summary>
          {/* sandbox="" : no scripts, no forms, no navigation, its own origin. */}
          <iframe
            sandbox=""
            srcDoc={message.html}
            title={`HTML version of “${message.subject}”`}
            className="mt-2 h-[28rem] w-full rounded-md border border-rule bg-white"
          />
        </details>
      ) : null}
    </article>
  );
}
