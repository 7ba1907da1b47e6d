'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { authedAction } from './authed';
import { formFields, idField, nestedFields, numberField } from './form-data';
import {
  addReading, createMeasurement, createPair, deleteMeasurement, deletePair, deleteReading, getMeasurement, updateMeasurement, updateReading,
} from '../server/measurements';
import { unauthenticated } from '../errors';
import type { MeasurementView } from '../types/measurements';

// Records and readings show on the builder's entry page and under the published log (the entry, the record,
// the project's measurements, counts on the timeline), all rendered on the server: a saved change renders them again.
function revalidateMeasurementPages(): void {
  revalidatePath('/(app)/projects/[slug]/entries/[entryId]/edit', 'page');
  revalidatePath('/(public)/logs/[slug]', 'layout');
}

/** A form's single reading (fields named readings.0.*, as the record form names them), or nothing. */
function oneReading(fields: Record<string, unknown>): unknown {
  return Array.isArray(fields.readings) ? fields.readings[0] : undefined;
}

/**
 * The new-measurement form of an entry: the record and all its readings (readings.N.*), saved together or
 * not at all. Hands back the record, for the verdict the form shows.
 */
export const createMeasurementAction = authedAction<FormData, MeasurementView>(async (user, form) => {
  const { entryId: _e, ...fields } = nestedFields(form);
  const entryId = idField({ entryId: _e as FormDataEntryValue }, 'entryId');
  const record = await createMeasurement(user, entryId, fields);
  revalidateMeasurementPages();
  return { ok: true, data: record };
});

/** A record's edit form, with the version it was opened at (stale: 409). */
export const updateMeasurementAction = authedAction<FormData, MeasurementView>(async (user, form) => {
  const { recordId: _r, version: _v, readings: _readings, ...fields } = nestedFields(form);
  const recordId = idField({ recordId: _r as FormDataEntryValue }, 'recordId');
  if (!user) throw unauthenticated('change this measurement');
  const version = numberField({ version: _v as FormDataEntryValue }, 'version');
  const record = await updateMeasurement(user, recordId, { ...fields, version });
  revalidateMeasurementPages();
  return { ok: true, data: record };
});

/** Deletes a record with its readings and fits, then goes to its entry. */
export const deleteMeasurementAction = authedAction<FormData, never>(async (user, form) => {
  const recordId = idField(formFields(form), 'recordId');
  if (!user) throw unauthenticated('change this measurement');
  // Where to go afterwards, from the record itself (read as this member sees it), never from the form.
  const { record } = await getMeasurement(user, recordId);
  await deleteMeasurement(user, recordId);
  revalidateMeasurementPages();
  redirect(`/logs/${record.project.slug}/entries/${record.entry.id}`);
});

/** Adds a reading (readings.0.*) to a record. */
export const addReadingAction = authedAction<FormData, never>(async (user, form) => {
  const fields = nestedFields(form);
  const recordId = idField({ recordId: fields.recordId as FormDataEntryValue }, 'recordId');
  await addReading(user, recordId, oneReading(fields) ?? {});
  revalidateMeasurementPages();
});

/** Changes a reading (readings.0.*), with the version it was opened at (stale: 409). */
export const updateReadingAction = authedAction<FormData, never>(async (user, form) => {
  const fields = nestedFields(form);
  const readingId = idField({ readingId: fields.readingId as FormDataEntryValue }, 'readingId');
  if (!user) throw unauthenticated('change this reading');
  const version = numberField({ version: fields.version as FormDataEntryValue }, 'version');
  const reading = oneReading(fields);
  await updateReading(user, readingId, { ...(reading && typeof reading === 'object' ? reading : {}), version });
  revalidateMeasurementPages();
});

/** Deletes a reading; a record's last reading stays (409). */
export const deleteReadingAction = authedAction<FormData, never>(async (user, form) => {
  await deleteReading(user, idField(formFields(form), 'readingId'));
  revalidateMeasurementPages();
});

/** Pairs an inside record (holeRecordId) with an outside one (shaftRecordId) of the same nominal size as a fit. */
export const createPairAction = authedAction<FormData, never>(async (user, form) => {
  const { holeRecordId, shaftRecordId } = formFields(form);
  await createPair(user, { holeRecordId, shaftRecordId });
  revalidateMeasurementPages();
});

/** Unpairs two records; the records stay. */
export const deletePairAction = authedAction<FormData, never>(async (user, form) => {
  await deletePair(user, idField(formFields(form), 'pairId'));
  revalidateMeasurementPages();
});
