import type { FitAnalysis, ToleranceZone } from '@/lib/fits';
import type { SizeUnit } from '@/lib/validations/fits-words';
import type { Nominal } from './read-entry';
import { clearanceWords, KIND_WORDS, nominalText } from './format';
import { FitKindIcon, KIND_TONE } from './fit-kind';
import { ZoneDrawing } from './zone-drawing';
import { ZoneLimits } from './zone-limits';
import { PressFitCaution } from './press-fit-caution';

type Props = { nominal: Nominal } & ({ fit: FitAnalysis; zone?: undefined } | { zone: ToleranceZone; fit?: undefined });

/** Everything the page says about one size with one zone or one fit. */
export function FitResult({ nominal, fit, zone }: Props) {
  const size = nominalText(nominal);
  const unit: SizeUnit = nominal.unit;
  const other: SizeUnit = unit === 'mm' ? 'in' : 'mm';
  const title = fit ? fit.fit : zone.zone;
  const zones = fit ? [fit.hole, fit.shaft] : [zone];

  return (
    <div className="space-y-5">
      <div className="space-y-1">
        <h2 className="text-2xl font-bold" data-testid="result-title">
          <span className="dim">Ø{size.typed}</span> {title}
        </h2>
        <p className="dim text-sm text-graphite-2">
          Nominal {size.typed} = {size.other}
        </p>
      </div>

      {fit ? (
        <div className={`flex items-start gap-3 rounded-lg border border-rule bg-card p-4 ${KIND_TONE[fit.kind]}`} data-testid="fit-verdict">
          <FitKindIcon kind={fit.kind} className="mt-0.5 h-8 w-8" />
          <div>
            <p className="text-lg font-bold">{KIND_WORDS[fit.kind].title}</p>
            <p className="dim text-base text-graphite">{clearanceWords(fit, unit)}</p>
            <p className="dim text-sm text-graphite-2">{clearanceWords(fit, other)}</p>
            <p className="mt-1 text-sm text-graphite-2">{KIND_WORDS[fit.kind].explain}</p>
          </div>
        </div>
      ) : null}

      {fit && fit.kind !== 'clearance' ? <PressFitCaution kind={fit.kind} /> : null}

      <figure className="rounded-lg border border-rule bg-card p-2 sm:p-4">
        <ZoneDrawing sizeLabel={size.typed} hole={fit ? fit.hole : zone.kind === 'hole' ? zone : undefined} shaft={fit ? fit.shaft : zone.kind === 'shaft' ? zone : undefined} kind={fit?.kind} unit={unit} />
        <figcaption className="mt-2 text-xs text-graphite-2">
          To scale, in micrometres. The heavy line is the zero line, the nominal size {size.typed}; each box spans its zone from the lower to the upper
          deviation{fit ? '. Hole hatched in blue on the left, shaft in grey on the right; the shaded strip between them is the smallest gap or the largest overlap' : ''}.
        </figcaption>
      </figure>

      <div className={`grid gap-4 ${zones.length === 2 ? 'xl:grid-cols-2' : ''}`}>
        {zones.map((z) => (
          <ZoneLimits key={z.kind} zone={z} unit={unit} />
        ))}
      </div>
    </div>
  );
}
