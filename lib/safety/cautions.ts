// The usual cautions for each kind of operation in a build log. Pure: no React, no database.
// Short, plain reminders of common shop practice — never a replacement for the machine's manual,
// local rules or someone qualified showing you how; the deferral line says so every time.
import type { Operation } from '../validations/log';

export const CAUTION_IDS = [
  'rotating',
  'first-start',
  'eyes',
  'chips',
  'dust',
  'tool-breakage',
  'thin-walls',
  'lifting',
  'press-fits',
  'electrical',
  'sharp-edges',
  'abrasives',
] as const;
export type CautionId = (typeof CAUTION_IDS)[number];

export type Caution = { id: CautionId; title: string; text: string };

export const CAUTIONS: Record<CautionId, Caution> = {
  rotating: {
    id: 'rotating',
    title: 'Rotating chucks and work',
    text: 'Take the chuck key out every time you let go of it. No gloves, loose sleeves, long hair, rings or other jewellery near the spindle or the turning work.',
  },
  'first-start': {
    id: 'first-start',
    title: 'First start after mounting',
    text: 'After mounting a chuck, plate or fixture, check it is fully seated and secured, turn the spindle by hand, start at low speed and stand out of the line of the chuck.',
  },
  eyes: {
    id: 'eyes',
    title: 'Eye protection',
    text: 'Wear safety glasses or a face shield whenever the machine runs, and keep its guards in place.',
  },
  chips: {
    id: 'chips',
    title: 'Hot and sharp chips',
    text: 'Chips come off hot and sharp. Never clear them with bare hands or while the spindle turns: stop the machine and use a brush or a chip hook.',
  },
  dust: {
    id: 'dust',
    title: 'Cast-iron and other fine dust',
    text: 'Cast iron cuts to a fine, abrasive dust: wear a dust mask, and clean up with a vacuum rather than compressed air, which throws it into the air and the machine’s slides.',
  },
  'tool-breakage': {
    id: 'tool-breakage',
    title: 'Breaking taps and drills',
    text: 'Taps and small drills snap and throw shards; a drill can grab as it breaks through and spin the work. Clamp the work, never hold it by hand, and back off to break the chip.',
  },
  'thin-walls': {
    id: 'thin-walls',
    title: 'Thin walls',
    text: 'Thin-walled work can crush, chatter or be thrown from the jaws: grip it lightly over a long length, or on a mandrel, and take light cuts.',
  },
  lifting: {
    id: 'lifting',
    title: 'Heavy parts and chucks',
    text: 'Chucks, plates, castings and dividing heads are heavy and awkward: lift close to the body, use a board across the bed or a lifting aid, and get help rather than lift at arm’s length.',
  },
  'press-fits': {
    id: 'press-fits',
    title: 'Press fits under load',
    text: 'A pressed part stores force and can crack, shear or fly out without warning. Use a proper press with the part supported squarely, keep hands clear of the ram and wear eye protection.',
  },
  electrical: {
    id: 'electrical',
    title: 'Electrical work on machines',
    text: 'Isolate and lock off the supply before opening a machine’s electrics; mains wiring is work for a qualified person.',
  },
  'sharp-edges': {
    id: 'sharp-edges',
    title: 'Sharp edges and cutters',
    text: 'Fresh edges and cutter teeth cut deeply: deburr before handling, and keep fingers clear of cutters even when the machine is stopped.',
  },
  abrasives: {
    id: 'abrasives',
    title: 'Abrasives on turning work',
    text: 'Hold emery or abrasive strip on a stick or backing board, never wrapped round your fingers; put a handle on every file.',
  },
};

/**
 * For every operation of our list, the cautions it usually carries — or, explicitly, none.
 * Indexed by Operation, so a new operation cannot be added without deciding its cautions.
 */
export const OPERATION_CAUTIONS: Record<Operation, readonly CautionId[]> = {
  layout: [],
  facing: ['rotating', 'eyes', 'chips', 'dust'],
  turning: ['rotating', 'eyes', 'chips', 'dust', 'thin-walls'],
  boring: ['rotating', 'eyes', 'chips', 'thin-walls', 'dust'],
  drilling: ['rotating', 'tool-breakage', 'eyes', 'chips', 'dust'],
  tapping: ['tool-breakage', 'eyes', 'rotating'],
  reaming: ['rotating', 'tool-breakage', 'eyes', 'chips'],
  threading: ['rotating', 'eyes', 'chips', 'thin-walls'],
  indexing: ['rotating', 'lifting', 'eyes', 'chips', 'sharp-edges'],
  'gear-cutting': ['rotating', 'eyes', 'chips', 'sharp-edges', 'dust'],
  fitting: ['press-fits', 'lifting', 'sharp-edges'],
  finishing: ['rotating', 'abrasives', 'dust', 'sharp-edges'],
  assembly: ['lifting', 'first-start', 'rotating', 'electrical'],
  other: [],
};

/** Said with every list of cautions: they are reminders; the manual, local rules and qualified instruction decide. */
export const DEFERRAL_LINE =
  'These are the usual cautions, not a complete list. Follow your machine’s manual, local rules and qualified instruction; when in doubt, stop the machine and ask.';

export type OperationCautions = { operation: Operation; cautions: Caution[]; deferral: string };

/** The cautions for an operation with the deferral line, or null when the operation carries none. */
export function cautionsFor(operation: Operation): OperationCautions | null {
  const ids = OPERATION_CAUTIONS[operation];
  if (!ids || !ids.length) return null;
  return { operation, cautions: ids.map((id) => CAUTIONS[id]), deferral: DEFERRAL_LINE };
}
