import { inchFitIsoComparison, type InchFit } from '@/lib/fits';
import { formatIn, formatMm, formatThou } from '@/lib/units/format';
import type { Nominal } from './read-entry';
import { clearanceWords, KIND_WORDS, nominalText } from './format';
import { FitKindIcon, KIND_TONE } from './fit-kind';
import { ZoneDrawing } from './zone-drawing';
import { PressFitCaution } from './press-fit-caution';
import { inchClearanceOther, inchClearanceWords, inchSideZone, thouIn, thouMm } from './inch-format';

type Props = { nominal: Nominal; inch: InchFit };

function SideLimits({ fit, side }: { fit: InchFit; side: 'hole' | 'shaft' }) {
  const s = fit[side];
  const max = { in: formatIn(fit.nominalIn + s.upperThou / 1000), mm: formatMm(fit.nominalMm + (s.upperThou * 254) / 10_000) };
  const min = { in: formatIn(fit.nominalIn + s.lowerThou / 1000), mm: formatMm(fit.nominalMm + (s.lowerThou * 254) / 10_000) };
  const title = `${side === 'hole' ? 'Hole' : 'Shaft'} of ${fit.fitClass}`;
  const testId = `inch-limits-${side}`;
  const rows = [
    { label: 'Upper limit', thou: formatThou(s.upperThou, { signed: true }), in: thouIn(s.upperThou, true), mm: thouMm(s.upperThou, true) },
    { label: 'Lower limit', thou: formatThou(s.lowerThou, { signed: true }), in: thouIn(s.lowerThou, true), mm: thouMm(s.lowerThou, true) },
    { label: 'Largest size', thou: '', in: max.in, mm: max.mm },
    { label: 'Smallest size', thou: '', in: min.in, mm: min.mm },
    { label: `Tolerance, grade ${s.grade}`, thou: formatThou(s.toleranceThou), in: thouIn(s.toleranceThou), mm: thouMm(s.toleranceThou) },
  ];
  return (
    <section className="rounded-lg border border-rule bg-card p-4" aria-labelledby={`${testId}-title`} data-testid={testId}>
      <h3 id={`${testId}-title`} className="text-base font-bold">
        {title}
      </h3>
      <p className="mt-1 text-sm text-graphite-2">Make it between</p>
      <p className="dim text-xl font-semibold sm:text-2xl">
        {min.in} and {max.in} in
      </p>
      <p className="dim text-base text-graphite-2">
        {min.mm} and {max.mm} mm
      </p>
      <table className="mt-3 w-full text-sm">
        <caption className="sr-only">{title}: limits in thousandths, inches and millimetres</caption>
        <thead>
          <tr className="border-b border-rule text-left text-xs text-graphite-2">
            <th scope="col" className="py-1 pr-2 font-semibold">
              <span className="sr-only">Value</span>
            </th>
            <th scope="col" className="py-1 pl-2 text-right font-semibold">thou</th>
            <th scope="col" className="py-1 pl-2 text-right font-semibold">in</th>
            <th scope="col" className="py-1 pl-2 text-right font-semibold">mm</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.label} className="border-b border-rule/60 last:border-0">
              <th scope="row" className="py-1.5 pr-2 text-left font-normal">
                {r.label}
              </th>
              <td className="dim py-1.5 pl-2 text-right">{r.thou}</td>
              <td className="dim py-1.5 pl-2 text-right">{r.in}</td>
              <td className="dim py-1.5 pl-2 text-right">{r.mm}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}

/** Everything the page says about one size with one ANSI B4.1 inch class. */
export function InchFitResult({ nominal, inch }: Props) {
  const size = nominalText(nominal);
  const iso = inchFitIsoComparison(inch);
  const hole = inchSideZone(inch, 'hole');
  const shaft = inchSideZone(inch, 'shaft');
  return (
    <div className="space-y-5">
      <div className="space-y-1">
        <h2 className="text-2xl font-bold" data-testid="result-title">
          <span className="dim">Ø{size.typed}</span> {inch.fitClass}
        </h2>
        <p className="dim text-sm text-graphite-2">
          Nominal {size.typed} = {size.other}
        </p>
        <p className="text-sm text-graphite-2">
          {inch.familyTitle}, ANSI B4.1, size step {inch.step.text}. Basic hole: the hole runs from the basic size upward.
        </p>
      </div>

      <div className={`flex items-start gap-3 rounded-lg border border-rule bg-card p-4 ${KIND_TONE[inch.kind]}`} data-testid="fit-verdict">
        <FitKindIcon kind={inch.kind} className="mt-0.5 h-8 w-8" />
        <div>
          <p className="text-lg font-bold">{KIND_WORDS[inch.kind].title}</p>
          <p className="dim text-base text-graphite">{inchClearanceWords(inch)}</p>
          <p className="dim text-sm text-graphite-2">
            {inchClearanceOther(inch, 'in')}; {inchClearanceOther(inch, 'mm')}
          </p>
          <p className="mt-1 text-sm text-graphite-2">{KIND_WORDS[inch.kind].explain}</p>
        </div>
      </div>

      {inch.kind !== 'clearance' ? <PressFitCaution kind={inch.kind} /> : null}

      <figure className="rounded-lg border border-rule bg-card p-2 sm:p-4">
        <ZoneDrawing sizeLabel={size.typed} hole={hole} shaft={shaft} kind={inch.kind} unit="in" titles={{ hole: `Hole ${inch.fitClass}`, shaft: `Shaft ${inch.fitClass}` }} />
        <figcaption className="mt-2 text-xs text-graphite-2">
          To scale, in micrometres with inches beneath (one thou is 25.4 µm). The heavy line is the zero line, the basic size {size.typed}. Hole
          hatched in blue on the left, shaft in grey on the right; the shaded strip between them is the smallest gap or the largest overlap.
        </figcaption>
      </figure>

      <div className="grid gap-4 xl:grid-cols-2">
        <SideLimits fit={inch} side="hole" />
        <SideLimits fit={inch} side="shaft" />
      </div>

      <section className="rounded-lg border border-dashed border-rule p-4 text-sm" aria-labelledby="iso-nearest" data-testid="iso-nearest">
        <h3 id="iso-nearest" className="font-bold">
          Nearest ISO 286 fit, approximately: <span className="dim">{iso.fit}</span>
        </h3>
        {iso.analysis ? (
          <p className="dim mt-1 text-graphite-2">
            {iso.fit} at {formatMm(inch.nominalMm)} mm: {clearanceWords(iso.analysis, 'mm')} ({clearanceWords(iso.analysis, 'in')})
          </p>
        ) : (
          <p className="mt-1 text-graphite-2">Not defined at this size: {iso.reason}</p>
        )}
        <p className="mt-1 text-xs text-graphite-2">
          A comparison in spirit only: the two standards have their own limits. Work to the class your drawing names.
        </p>
      </section>
    </div>
  );
}
