// The printed shop sheet: what to hit, with what, the saved set-ups, what the mentors flagged and the
// usual cautions, with boxes to write readings in by hand. A server component; the page around it holds
// the on-screen controls (print:hidden).
import type { ReactNode } from 'react';
import type { Length } from '@/lib/calculators';
import type { SummaryValue } from '@/lib/calculators/pages/summary';
import { formatIn, readoutMm } from '@/lib/units/format';
import { formatDay } from '@/lib/format';
import { FLAG_STATUS_LABEL, hazardLabel, severityLabel } from '@/lib/validations/flags';
import type { SessionSheet, SheetCalculation, SheetRecord } from '@/lib/types/sheets';

const both = (l: Length, first: 'mm' | 'in' = 'mm') =>
  first === 'in' ? `${formatIn(l.in)} in (${readoutMm(l.mm)} mm)` : `${readoutMm(l.mm)} mm (${formatIn(l.in)} in)`;

function valueText(v: SummaryValue): string {
  const parts: string[] = [];
  // A metric drill's name is its size: "6.8 mm" beside "6.800 mm" says nothing new.
  if (v.text && !(v.len && /^\d+(?:\.\d+)? mm$/.test(v.text))) parts.push(v.text);
  if (v.len) parts.push(both(v.len, v.first));
  if (v.note) parts.push(v.note);
  return parts.join(' · ');
}

const cell = (c: string | Length): ReactNode =>
  typeof c === 'string' ? (
    c
  ) : (
    <>
      {readoutMm(c.mm)} <span className="text-graphite-2">({formatIn(c.in)} in)</span>
    </>
  );

/** An empty box to write a reading in. */
function Box({ label, wide = false }: { label: string; wide?: boolean }) {
  return (
    <span className={`inline-block h-7 rounded-sm border border-graphite align-middle ${wide ? 'w-24' : 'w-10'}`} aria-label={label} role="img" data-testid="reading-box" />
  );
}

function SectionTitle({ id, children }: { id: string; children: ReactNode }) {
  return (
    <h2 id={id} className="mb-1 border-b-2 border-graphite text-sm font-bold uppercase tracking-wide">
      {children}
    </h2>
  );
}

function RecordRow({ r, index }: { r: SheetRecord; index: number }) {
  const [own, other] = r.sizes;
  return (
    <tr className="break-inside-avoid border-b border-rule align-top" data-testid="sheet-record" data-record-id={r.id}>
      <th scope="row" className="py-1 pr-2 text-left font-normal">
        <span className="font-bold">
          {index + 1}. {r.feature}
        </span>
        <span className="block text-[0.85em] text-graphite-2">
          {r.kind === 'outside' ? 'Outside' : 'Inside'} · {r.nominalText} {r.specLabel} · {r.entryTitle}
        </span>
        {r.latest ? (
          <span className="block text-[0.85em] text-graphite-2">
            Last read {r.latest.valueText} {r.latest.unit}: {r.latest.verdict}
          </span>
        ) : null}
      </th>
      <td className="dim py-1 pr-2">
        {[own, other].map((s) => (
          <span key={s.unit} className="block" data-testid={`limits-${s.unit}`}>
            <span className={`whitespace-nowrap ${s === own ? 'font-bold' : ''}`}>
              {s.min} – {s.max} {s.unit}
            </span>{' '}
            <span className="whitespace-nowrap text-[0.85em] text-graphite-2">
              ({s.lower} / {s.upper}
              {s.exact ? '' : ', inward'})
            </span>
          </span>
        ))}
      </td>
      <td className="py-1 pr-2">
        {r.instrument.label}
        <span className="dim block text-[0.85em] text-graphite-2">
          reads {r.instrument.resolutionText}
          {r.instrument.meetsRule ? '' : ' — coarser than a tenth of the band'}
        </span>
        {r.lastInstrument ? <span className="block text-[0.85em] text-graphite-2">last time: {r.lastInstrument}</span> : null}
      </td>
      <td className="whitespace-nowrap py-1">
        <span className="flex items-center gap-1">
          <Box label={`${r.feature}: reading 1`} />
          <Box label={`${r.feature}: reading 2`} />
          <Box label={`${r.feature}: reading 3`} />
          <span className="ml-1 text-[0.85em]">°C</span>
          <Box label={`${r.feature}: temperature`} />
        </span>
      </td>
    </tr>
  );
}

function CalculationBlock({ c }: { c: SheetCalculation }) {
  const s = c.summary;
  return (
    <section className={`break-inside-avoid rounded border border-rule px-2 py-1 ${s?.table ? 'col-span-full' : ''}`} aria-label={c.label} data-testid="sheet-calculation" data-kind={c.kind}>
      <h3 className="text-[1em] font-bold leading-tight">{c.label}</h3>
      <p className="text-[0.85em] text-graphite-2">
        {c.calculatorName} · {c.entryTitle}
        {c.olderTables ? ` · worked out with tables ${c.olderTables}` : ''}
      </p>
      {s ? (
        <>
          <p className="text-[0.85em]">{s.inputs.map((i) => `${i.label}: ${valueText(i.value)}`).join(' · ')}</p>
          <dl className="mt-0.5">
            {s.results.map((r) => (
              <div key={r.label}>
                <dt className="inline text-graphite-2">{r.label}: </dt>
                <dd className={`dim inline ${r.strong ? 'font-bold' : ''}`}>{valueText(r.value)}</dd>
              </div>
            ))}
          </dl>
          {s.table ? (
            <table className="dim mt-1 w-full text-[0.9em]">
              <caption className="caption-top text-left font-sans text-[0.85em] text-graphite-2">{s.table.caption}, mm (in)</caption>
              <thead>
                <tr className="border-b border-graphite text-left">
                  {s.table.head.map((h, i) => (
                    <th key={h} scope="col" className={`pr-2 font-semibold ${i ? 'text-right' : ''}`}>
                      {h}
                    </th>
                  ))}
                  <th scope="col" className="text-right font-semibold">
                    Done
                  </th>
                </tr>
              </thead>
              <tbody>
                {s.table.rows.map((row) => (
                  <tr key={row.key} className="border-b border-rule">
                    {row.cells.map((v, i) =>
                      i === 0 ? (
                        <th key={i} scope="row" className="pr-2 text-left font-semibold">
                          {cell(v)}
                        </th>
                      ) : (
                        <td key={i} className="whitespace-nowrap pr-2 text-right">
                          {cell(v)}
                        </td>
                      ),
                    )}
                    <td className="text-right">
                      <span className="inline-block h-3.5 w-3.5 border border-graphite align-middle" aria-hidden="true" />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
          {s.warnings.length ? (
            <ul className="mt-1 text-[0.85em]">
              {s.warnings.map((w) => (
                <li key={w}>⚠ {w}</li>
              ))}
            </ul>
          ) : null}
        </>
      ) : (
        <p className="text-[0.85em]">This saved result cannot be shown here; open it in the calculator.</p>
      )}
    </section>
  );
}

export function ShopSheet({ sheet, printedFor }: { sheet: SessionSheet; printedFor: string }) {
  const { project, session, records, calculations, flags, cautions } = sheet;
  return (
    <article className="shop-sheet space-y-3 bg-card p-4 text-[10pt] leading-snug print:bg-transparent print:p-0 print:text-[8pt]" aria-labelledby="sheet-title" data-testid="shop-sheet">
      <header className="flex flex-wrap items-end justify-between gap-2 border-b-2 border-graphite pb-1">
        <div>
          <p className="text-[0.85em] font-semibold uppercase tracking-wide text-graphite-2">Shop sheet · {project.title}</p>
          <h1 id="sheet-title" className="text-[1.5em] font-bold leading-tight">
            Session {session.position + 1}: {session.title}
          </h1>
          <p className="text-[0.85em] text-graphite-2">
            Logged for <time dateTime={session.heldOn}>{formatDay(session.heldOn)}</time> · printed for {printedFor}
          </p>
        </div>
        <p className="text-[0.9em]">
          Date <Box label="Date worked" wide /> Machine <Box label="Machine" wide />
        </p>
      </header>

      {session.planned ? (
        <p className="text-[0.9em]">
          <span className="font-bold">Planned: </span>
          <span className="whitespace-pre-line">{session.planned}</span>
        </p>
      ) : null}

      <section aria-labelledby="sheet-sizes">
        <SectionTitle id="sheet-sizes">Sizes to hit</SectionTitle>
        {records.length ? (
          <table className="w-full table-fixed text-left">
            <colgroup>
              <col className="w-[30%]" />
              <col className="w-[33%]" />
              <col className="w-[14%]" />
              <col className="w-[23%]" />
            </colgroup>
            <thead>
              <tr className="border-b border-graphite text-[0.85em]">
                <th scope="col" className="pr-2 font-semibold">
                  Feature
                </th>
                <th scope="col" className="pr-2 font-semibold">
                  Smallest – largest (deviations)
                </th>
                <th scope="col" className="pr-2 font-semibold">
                  Measure with
                </th>
                <th scope="col" className="font-semibold">
                  Readings
                </th>
              </tr>
            </thead>
            <tbody>
              {records.map((r, i) => (
                <RecordRow key={r.id} r={r} index={i} />
              ))}
            </tbody>
          </table>
        ) : (
          <p className="text-graphite-2">No measurement records in this session{sheet.chosen ? ' were chosen' : ''}.</p>
        )}
        <p className="mt-1 text-[0.8em] text-graphite-2">
          Limits from each record’s specification ({[...new Set(records.map((r) => r.source.replace(/ at .*$/, '').replace(/:.*$/, '')))].join('; ') || 'none'}). In the
          other unit the limits are rounded inward to 0.001 mm / 0.0001 in, so a part inside them is inside the drawing’s. Instrument by the ten-to-one rule
          (common practice): it should read a tenth of the band or finer. Measure at about 20 °C (ISO 1).
        </p>
      </section>

      {calculations.length ? (
        <section aria-labelledby="sheet-setups">
          <SectionTitle id="sheet-setups">Set-ups worked out</SectionTitle>
          <div className="grid grid-cols-2 gap-2">
            {calculations.map((c) => (
              <CalculationBlock key={c.id} c={c} />
            ))}
          </div>
        </section>
      ) : null}

      <section aria-labelledby="sheet-flags">
        <SectionTitle id="sheet-flags">Open mentor flags</SectionTitle>
        {flags.length ? (
          <ul className="space-y-1">
            {flags.map((f) => (
              <li key={f.id} className="break-inside-avoid border-l-4 border-scribe pl-2" data-testid="sheet-flag">
                <p>
                  <span className="font-bold">
                    ⚠ {severityLabel(f.severity)} · {hazardLabel(f.hazard)}
                  </span>{' '}
                  <span className="text-[0.85em] text-graphite-2">
                    ({FLAG_STATUS_LABEL[f.status]}) · {f.entryTitle}
                    {f.target ? ` — ${f.target}` : ''} · {f.mentor}
                  </span>
                </p>
                <p className="whitespace-pre-line">{f.concern}</p>
                <p className="whitespace-pre-line">
                  <span className="font-semibold">Instead: </span>
                  {f.instead}
                </p>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-graphite-2">No open flags on this session.</p>
        )}
      </section>

      <section aria-labelledby="sheet-cautions">
        <SectionTitle id="sheet-cautions">Cautions</SectionTitle>
        {cautions.length ? (
          <ul className="grid grid-cols-2 gap-x-4 text-[0.85em] print:grid-cols-3">
            {cautions.map((c) => (
              <li key={c.id} className="break-inside-avoid">
                <span className="font-bold">{c.title}</span> <span className="text-graphite-2">({c.operations.join(', ')})</span>: {c.text}
              </li>
            ))}
          </ul>
        ) : null}
        <p className="mt-1 text-[0.85em] font-semibold">{sheet.deferral}</p>
      </section>

      <section aria-labelledby="sheet-notes" className="break-inside-avoid">
        <SectionTitle id="sheet-notes">Notes at the machine</SectionTitle>
        <div className="h-14 border border-rule print:h-10" role="img" aria-label="Space for notes" />
      </section>
    </article>
  );
}
