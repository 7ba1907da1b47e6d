'use client';

import { useState } from 'react';
import type { MeasurementView } from '@/lib/types/measurements';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { deleteMeasurementAction } from '@/lib/actions/measurements';
import { IDLE } from '@/components/forms/action-state';
import type { MomentOption } from './record-form';
import { RecordForm } from './lazy-editors';

/** The builder's controls on a record page: change the record, or delete it with its readings and fits. */
export function RecordActions({ record, moments, builderName }: { record: MeasurementView; moments: MomentOption[]; builderName: string }) {
  const [editing, setEditing] = useState(false);
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        <Button type="button" tone="quiet" onClick={() => setEditing((e) => !e)} aria-expanded={editing}>
          {editing ? 'Close the editor' : 'Edit record'}
        </Button>
        <ConfirmDialog
          trigger="Delete record"
          title={`Delete “${record.feature}”?`}
          body={<p>The record, its {record.readings.length === 1 ? 'reading' : `${record.readings.length} readings`} and any fit it is part of go for good.</p>}
          confirmLabel="Delete record"
          onConfirm={async () => {
            const data = new FormData();
            data.set('recordId', String(record.id));
            // On success the action goes to the record's entry; a refusal comes back as its message.
            const state = await deleteMeasurementAction(IDLE, data);
            return state.ok ? null : (state.message ?? 'Not deleted.');
          }}
        />
      </div>
      {editing ? (
        <RecordForm
          mode="edit"
          record={record}
          moments={moments}
          builderName={builderName}
          onCancel={() => setEditing(false)}
          onSaved={() => setEditing(false)}
        />
      ) : null}
    </div>
  );
}
