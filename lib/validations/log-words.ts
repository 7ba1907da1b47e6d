// The words of the log (operations, kinds of note), without the schemas of lib/validations/log.ts: what a
// reader's page shows needs these and must not bring the validation library along.

/** Our list of operations, from the trade. */
export const OPERATIONS = [
  { value: 'layout', label: 'Layout' },
  { value: 'facing', label: 'Facing' },
  { value: 'turning', label: 'Turning' },
  { value: 'boring', label: 'Boring' },
  { value: 'drilling', label: 'Drilling' },
  { value: 'tapping', label: 'Tapping' },
  { value: 'reaming', label: 'Reaming' },
  { value: 'threading', label: 'Threading' },
  { value: 'indexing', label: 'Indexing' },
  { value: 'gear-cutting', label: 'Gear cutting' },
  { value: 'fitting', label: 'Fitting' },
  { value: 'finishing', label: 'Finishing' },
  { value: 'assembly', label: 'Assembly' },
  { value: 'other', label: 'Other' },
] as const;
export type Operation = (typeof OPERATIONS)[number]['value'];

export const NOTE_KIND_OPTIONS = [
  { value: 'note', label: 'Note' },
  { value: 'measurement', label: 'Measurement' },
  { value: 'caution', label: 'Caution' },
  { value: 'question', label: 'Question' },
] as const;
export type NoteKind = (typeof NOTE_KIND_OPTIONS)[number]['value'];

export const NOTE_TEXT_MAX = 2000;
/** Caption files are read in the browser and sent as text; a chapter or caption file is far smaller than this. */
export const CAPTION_FILE_MAX_BYTES = 1024 * 1024;
