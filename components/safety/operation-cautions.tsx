import { cautionsFor } from '@/lib/safety/cautions';
import { OPERATIONS, type Operation } from '@/lib/validations/log-words';

/**
 * The usual cautions for the entry's operation: one quiet line that opens into the list, so it is always
 * there without shouting over the log. Nothing for operations that carry none.
 */
export function OperationCautions({ operation, open = false }: { operation: Operation; open?: boolean }) {
  const found = cautionsFor(operation);
  if (!found) return null;
  const label = OPERATIONS.find((o) => o.value === operation)?.label ?? operation;
  return (
    <details className="group rounded-md border border-scribe/40 bg-scribe-soft/40 text-sm" data-testid="operation-cautions" open={open}>
      <summary className="flex min-h-11 cursor-pointer list-none items-center gap-2 px-3 py-2 font-semibold [&::-webkit-details-marker]:hidden">
        <span aria-hidden="true" className="text-scribe">
          ⚠
        </span>
        <span>
          Usual cautions for {label.toLowerCase()} <span className="font-normal text-graphite-2">({found.cautions.length})</span>
        </span>
        <span aria-hidden="true" className="ml-auto text-graphite-2 transition-transform group-open:rotate-90">
          ›
        </span>
      </summary>
      <div className="space-y-2 border-t border-scribe/30 px-3 py-3">
        <ul className="space-y-1.5">
          {found.cautions.map((c) => (
            <li key={c.id} className="pl-4 -indent-4">
              <span aria-hidden="true" className="text-scribe">
                ▸{' '}
              </span>
              <strong>{c.title}.</strong> {c.text}
            </li>
          ))}
        </ul>
        <p className="text-graphite-2">{found.deferral}</p>
      </div>
    </details>
  );
}
