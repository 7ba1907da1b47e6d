'use client';

import { useState } from 'react';
import Link from 'next/link';
import { verdictShort, type LengthUnit } from '@/lib/measurements';
import type { MeasurementView } from '@/lib/types/measurements';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { RecordForm, type MomentOption } from './record-form';
import { PlusIcon } from '@/components/ui/plus-icon';

type Props = { entryId: number; projectUnits: LengthUnit; builderName: string; moments: MomentOption[] };

/** "Add a measurement" on the builder's entry page: opens the record form; its action renders the table again. */
export function AddMeasurement({ entryId, projectUnits, builderName, moments }: Props) {
  const [open, setOpen] = useState(false);
  const [saved, setSaved] = useState<MeasurementView | null>(null);

  return (
    <div className="space-y-3">
      {saved ? (
        <Notice kind={saved.verdict.state === 'inside' ? 'success' : 'caution'} role="status" title={`Saved “${saved.feature}”`}>
          <p data-testid="saved-verdict">
            Latest reading: {verdictShort(saved.verdict, saved.unit)}
            {saved.verdict.state === 'over' ? ', over the upper limit' : saved.verdict.state === 'under' ? ', under the lower limit' : ''}.{' '}
            <Link href={`/logs/${saved.project.slug}/records/${saved.id}`}>Open the record</Link> to plot it, add readings or pair it with its mating part.
          </p>
        </Notice>
      ) : null}
      {open ? (
        <RecordForm
          mode="create"
          entryId={entryId}
          projectUnits={projectUnits}
          builderName={builderName}
          moments={moments}
          onCancel={() => setOpen(false)}
          onSaved={(record) => {
            setSaved(record);
            setOpen(false);
          }}
        />
      ) : (
        <Button
          type="button"
          onClick={() => {
            setSaved(null);
            setOpen(true);
          }}
        >
          <PlusIcon /> Add a measurement
        </Button>
      )}
    </div>
  );
}
