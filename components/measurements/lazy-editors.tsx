'use client';

import dynamic from 'next/dynamic';
import { FormLoading } from '@/components/forms/form-loading';

// The builder's editors on a record page (react-hook-form, zod, the live verdict preview and the ISO 286
// and inch tables behind it) load when they are opened: "Edit record", "Add a reading" or a reading's "Edit".
// A reader of a record page, or of the project's measurements, loads none of them. (The record's buttons come
// with the page, so a click on them works as soon as the page does.)

export const RecordForm = dynamic(() => import('./record-form').then((m) => m.RecordForm), { loading: FormLoading });
export const ReadingForm = dynamic(() => import('./reading-form').then((m) => m.ReadingForm), { loading: FormLoading });
