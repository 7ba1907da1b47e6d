import { describe, expect, it } from 'vitest';
import { CAUTIONS, CAUTION_IDS, cautionsFor, DEFERRAL_LINE, OPERATION_CAUTIONS } from '@/lib/safety/cautions';
import { OPERATIONS } from '@/lib/validations/log';

const allText = (id: keyof typeof CAUTIONS) => `${CAUTIONS[id].title} ${CAUTIONS[id].text}`.toLowerCase();

describe('operation cautions', () => {
  it('every operation of our list maps to cautions or, explicitly, to none', () => {
    for (const { value } of OPERATIONS) {
      expect(Object.prototype.hasOwnProperty.call(OPERATION_CAUTIONS, value), `${value} has no entry`).toBe(true);
      expect(Array.isArray(OPERATION_CAUTIONS[value])).toBe(true);
      for (const id of OPERATION_CAUTIONS[value]) expect(CAUTION_IDS).toContain(id);
    }
    // Nothing is mapped that is not an operation.
    expect(Object.keys(OPERATION_CAUTIONS).sort()).toEqual(OPERATIONS.map((o) => o.value).sort());
  });

  it('every operation with cautions carries the line deferring to the manual, local rules and qualified instruction', () => {
    for (const { value } of OPERATIONS) {
      const found = cautionsFor(value);
      if (!OPERATION_CAUTIONS[value].length) {
        expect(found).toBeNull();
        continue;
      }
      expect(found!.deferral).toBe(DEFERRAL_LINE);
      expect(found!.cautions.length).toBe(OPERATION_CAUTIONS[value].length);
    }
    expect(DEFERRAL_LINE).toMatch(/machine’s manual/);
    expect(DEFERRAL_LINE).toMatch(/local rules/);
    expect(DEFERRAL_LINE).toMatch(/qualified instruction/);
  });

  // Operations where the work or the tool turns under power (common practice): each carries the rotating-parts caution.
  it.each(['facing', 'turning', 'boring', 'drilling', 'reaming', 'threading', 'gear-cutting'] as const)('%s warns of rotating chucks and work', (op) => {
    expect(OPERATION_CAUTIONS[op]).toContain('rotating');
    expect(OPERATION_CAUTIONS[op]).toContain('eyes');
  });

  it.each([
    // domain.md, Safety — the list of usual cautions the product must be able to show.
    ['chuck key', 'rotating'],
    ['gloves', 'rotating'],
    ['loose sleeves', 'rotating'],
    ['long hair', 'rotating'],
    ['jewellery', 'rotating'],
    ['eye protection', 'eyes'],
    ['hot and sharp', 'chips'],
    ['mask', 'dust'],
    ['vacuum rather than compressed air', 'dust'],
    ['taps and', 'tool-breakage'],
    ['thin-walled', 'thin-walls'],
    ['heavy', 'lifting'],
    ['pressed part', 'press-fits'],
    ['electrics', 'electrical'],
  ] as const)('the “%s” caution is in %s', (words, id) => {
    expect(allText(id)).toContain(words);
  });

  it('taps and drills, and press fits, show where they belong (common practice)', () => {
    expect(OPERATION_CAUTIONS.tapping).toContain('tool-breakage');
    expect(OPERATION_CAUTIONS.drilling).toContain('tool-breakage');
    expect(OPERATION_CAUTIONS.fitting).toContain('press-fits');
    expect(OPERATION_CAUTIONS.assembly).toContain('first-start');
  });
});
