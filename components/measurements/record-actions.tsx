'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import type { MeasurementView } from '@/lib/types/measurements';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { sendJson } from '@/lib/client/api-client';
import { RecordForm, type MomentOption } from './record-form';

/** The builder's controls on a record page: change the record, or delete it with its readings and fits. */
export function RecordActions({ record, moments, builderName }: { record: MeasurementView; moments: MomentOption[]; builderName: string }) {
  const router = useRouter();
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
            const res = await sendJson(`/api/measurements/${record.id}`, 'DELETE');
            if (!res.ok) return res.error.message;
            router.push(`/logs/${record.project.slug}/entries/${record.entry.id}`);
            router.refresh();
            return null;
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
          onSaved={() => {
            setEditing(false);
            router.refresh();
          }}
        />
      ) : null}
    </div>
  );
}
