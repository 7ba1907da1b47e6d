'use client';

import dynamic from 'next/dynamic';
import { FormLoading } from '@/components/forms/form-loading';

// The builder's editors on a record page (react-hook-form, zod, the live verdict preview and the ISO 286
// tables behind it) load only where they are shown: a reader of a record page, or of the project's
// measurements, loads none of them. The record's buttons are drawn with the builder's page (a placeholder of
// their height first, so nothing moves); a reading's form when "Add a reading" or "Edit" is pressed.

export const RecordActions = dynamic(() => import('./record-actions').then((m) => m.RecordActions), {
  loading: () => <div className="min-h-11" />,
});
export const RecordForm = dynamic(() => import('./record-form').then((m) => m.RecordForm), { loading: FormLoading });
export const ReadingForm = dynamic(() => import('./reading-form').then((m) => m.ReadingForm), { loading: FormLoading });
