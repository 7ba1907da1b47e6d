/**
 * The preferred hole-basis fits of ISO 286-1 (also listed in ANSI B4.2 as the
 * preferred metric fits), loosest to tightest, each with a plain note on
 * where a home shop would use it. The notes are our own rules of thumb.
 */

export type FitFamily = 'running' | 'sliding' | 'locating' | 'press';

export interface PreferredFit {
  /** Fit as written, hole first. */
  fit: string;
  hole: string;
  shaft: string;
  family: FitFamily;
  /** Short name used in the UI. */
  name: string;
  /** One line: where it is used. */
  use: string;
}

export const PREFERRED_HOLE_BASIS_FITS: readonly PreferredFit[] = [
  {
    fit: 'H11/c11', hole: 'H11', shaft: 'c11', family: 'running', name: 'Loose running',
    use: 'Lots of play for parts that must keep turning when dirty, hot or roughly finished: hinge pins, linkage pivots, hand-wheel spindles.',
  },
  {
    fit: 'H9/d9', hole: 'H9', shaft: 'd9', family: 'running', name: 'Free running',
    use: 'Generous play where accuracy matters less than freedom: fast or heavily loaded plain bearings, idler pulleys, loose gears on a shaft.',
  },
  {
    fit: 'H8/f7', hole: 'H8', shaft: 'f7', family: 'running', name: 'Close running',
    use: 'Oiled shaft in a plain bushing turning at moderate speed with little shake: lathe and mill spindles in bronze, lead-screw bearings.',
  },
  {
    fit: 'H7/g6', hole: 'H7', shaft: 'g6', family: 'sliding', name: 'Sliding',
    use: 'Parts that slide or turn slowly with almost no shake: change-gear studs, sliding collars, spigots and plungers.',
  },
  {
    fit: 'H7/h6', hole: 'H7', shaft: 'h6', family: 'locating', name: 'Locating clearance',
    use: 'Goes together by hand, oiled, and locates snugly yet comes apart again: fixture registers, spigots on face plates, tool holders.',
  },
  {
    fit: 'H7/k6', hole: 'H7', shaft: 'k6', family: 'locating', name: 'Locating transition',
    use: 'Accurate location, a light tap with a soft mallet to assemble: keyed gears, pulleys and couplings on a shaft.',
  },
  {
    fit: 'H7/n6', hole: 'H7', shaft: 'n6', family: 'locating', name: 'Tight locating transition',
    use: 'Firm tap or light press, must not move yet can be pulled off: gear hubs, bushings that will be replaced, armatures.',
  },
  {
    fit: 'H7/p6', hole: 'H7', shaft: 'p6', family: 'press', name: 'Light press',
    use: 'Rigid location by a light press fit that can still be pressed apart: dowel pins, bushings in steel or cast iron housings.',
  },
  {
    fit: 'H7/s6', hole: 'H7', shaft: 's6', family: 'press', name: 'Medium press',
    use: 'Permanent steel-on-steel assembly in an arbor press: bronze bushings for good, gear hubs and collars that carry torque.',
  },
  {
    fit: 'H7/u6', hole: 'H7', shaft: 'u6', family: 'press', name: 'Force or shrink',
    use: 'Heavy press or heat the hub: parts that must carry high torque by grip alone, shrunk-on rings and couplings.',
  },
];
