/**
 * Usual shop cautions shown beside the calculators whose work can hurt
 * someone. Short on purpose: they remind, they do not teach.
 */

export type CautionTopic = 'tapping' | 'thinWalls' | 'rotatingWork' | 'drilling';

export interface Caution {
  title: string;
  points: readonly string[];
  /** Said under every caution. */
  defer: string;
}

export const CAUTION_DEFER = "Follow your machine's manual, local rules and qualified instruction; these numbers are a starting point, not a guarantee.";

export const CAUTIONS: Readonly<Record<CautionTopic, Caution>> = {
  tapping: {
    title: 'Tapping',
    points: [
      'Taps are hard and brittle: a tap that binds snaps, and a broken tap is very hard to get out.',
      'Keep the tap square to the hole, back it off to break the chip, and use cutting fluid.',
      'Above about 85 % of thread, in small sizes or tough steel, expect the tap to bind: use a larger drill.',
      'Power tapping needs a tapping head or a machine made for it; keep hands clear of the chuck.',
    ],
    defer: CAUTION_DEFER,
  },
  thinWalls: {
    title: 'Thin walls',
    points: [
      'A thin wall beside a counterbore or hole can bulge, crack or tear out when the screw is tightened.',
      'Thin sections can spring or chatter while cut and grab a drill as it breaks through: clamp the work well.',
      'Check the wall on the part itself before drilling, not only on the drawing.',
    ],
    defer: CAUTION_DEFER,
  },
  rotatingWork: {
    title: 'Rotating work: lathe, dividing head, rotary table',
    points: [
      'Remove the chuck key before starting the machine, every time.',
      'No gloves, loose sleeves, long hair or jewellery near rotating parts.',
      'Lock the dividing head or rotary table spindle before each cut, and unlock it only to index.',
      'Check the work clears the head, clamps and table through a full turn by hand before power.',
      'Wear eye protection: chips are hot and sharp.',
    ],
    defer: CAUTION_DEFER,
  },
  drilling: {
    title: 'Drilling',
    points: [
      'Clamp the work or hold it in a vice: a drill that grabs spins loose work.',
      'Ease the feed as the drill breaks through, above all in brass and thin sheet.',
      'Centre-drill or spot first, clear chips often in deep holes, and use the speed for the material and size.',
      'Wear eye protection; clear chips with a brush, never by hand or compressed air.',
    ],
    defer: CAUTION_DEFER,
  },
};
