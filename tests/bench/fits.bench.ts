/**
 * Throughput of the ISO 286 engine on one core.
 * Run: npx tsx tests/bench/fits.bench.ts   (or npm run bench:fits)
 *
 * The mix spreads sizes over every range (including the subdivisions and
 * sizes above 500 mm) and zones over holes, shafts, JS/js, J/j and the Δ
 * letters, so the figure is not one cached hot path.
 */

import { analyseFit, inchFit, INCH_CLASS_NAMES, isInchFitDefined, isZoneDefined, toleranceZone, type ToleranceZone } from '../../lib/fits/index';

const SIZES = [
  0.8, 2, 3, 4.5, 6, 8, 10, 12, 14, 16, 18, 20, 24, 25, 30, 30.001, 35, 45, 50, 60, 70, 80, 90, 110, 120,
  130, 150, 170, 190, 210, 240, 250, 260, 300, 315, 350, 380, 420, 480, 500,
];
const LARGE_SIZES = [520, 600, 700, 750, 850, 950, 1100, 1200, 1300, 1500, 1700, 1900, 2100, 2400, 2600, 3000, 3150];

const ZONES_ANY_SIZE = [
  'H7', 'H8', 'H11', 'h6', 'h9', 'g6', 'G7', 'f7', 'F8', 'e8', 'E9', 'd9', 'D10', 'js6', 'JS7', 'js11',
  'k6', 'K7', 'm6', 'M7', 'n6', 'N7', 'N9', 'p6', 'P7', 'r6', 'R7', 's6', 'S7', 'u6', 'U7', 'M6', 'K6',
];
const ZONES_TO_500 = ['c11', 'C11', 'b11', 'a11', 'x8', 'z9', 'ZC10', 'za7', 'j6', 'J7', 'h01', 'H0'];
const FITS = ['H7/g6', 'H7/h6', 'H7/k6', 'H7/n6', 'H7/p6', 'H7/s6', 'H8/f7', 'H9/d9', 'H7/js6', 'JS7/h6'];
const FITS_TO_500 = ['H11/c11', 'H7/j6', 'H7/x8'];

interface Job { size: number; text: string }

function buildMix(): { zones: Job[]; fits: Job[] } {
  const zones: Job[] = [];
  const fits: Job[] = [];
  for (const size of SIZES) {
    // A few zones are refused at the smallest sizes (a, b, N9 at or below 1 mm…): leave those out.
    for (const z of [...ZONES_ANY_SIZE, ...ZONES_TO_500]) if (isZoneDefined(size, z)) zones.push({ size, text: z });
    for (const f of [...FITS, ...FITS_TO_500]) {
      if (f.split('/').every((z) => isZoneDefined(size, z))) fits.push({ size, text: f });
    }
  }
  for (const size of LARGE_SIZES) {
    for (const z of ZONES_ANY_SIZE) zones.push({ size, text: z });
    for (const f of FITS) fits.push({ size, text: f });
  }
  // Deterministic shuffle so that neighbouring calls differ.
  let seed = 12345;
  const shuffle = <T>(a: T[]) => {
    for (let i = a.length - 1; i > 0; i--) {
      seed = (seed * 1103515245 + 12345) >>> 0;
      const j = seed % (i + 1);
      [a[i], a[j]] = [a[j] as T, a[i] as T];
    }
    return a;
  };
  return { zones: shuffle(zones), fits: shuffle(fits) };
}

function run(label: string, jobs: Job[], call: (job: Job) => number, minMs = 1500): number {
  let sink = 0;
  // Warm-up so the JIT has compiled the hot path.
  for (let i = 0; i < 200_000; i++) sink += call(jobs[i % jobs.length] as Job);
  let count = 0;
  const start = performance.now();
  let elapsed = 0;
  do {
    for (let i = 0; i < jobs.length; i++) sink += call(jobs[i] as Job);
    count += jobs.length;
    elapsed = performance.now() - start;
  } while (elapsed < minMs);
  const perSecond = (count / elapsed) * 1000;
  console.log(`${label.padEnd(24)} ${Math.round(perSecond).toLocaleString('en-US').padStart(12)} /s   (${count.toLocaleString('en-US')} calls, ${jobs.length} distinct, checksum ${sink.toFixed(2)})`);
  return perSecond;
}

const { zones, fits } = buildMix();
const zoneRate = run('zone look-ups', zones, (j) => {
  const z: ToleranceZone = toleranceZone(j.size, j.text);
  return z.upperUm - z.lowerUm;
});
const fitRate = run('fit analyses', fits, (j) => analyseFit(j.size, j.text).maxClearanceUm);

// ANSI B4.1 inch classes: every class over sizes spread across its table, in inches.
const INCH_SIZES = [0.05, 0.12, 0.2, 0.3, 0.5, 0.75, 1, 1.25, 1.5, 2, 2.5, 3, 4, 5, 6, 7, 8, 9, 10, 12, 14, 16, 18, 19.69, 25, 40, 60, 90, 120, 160, 200];
const inchJobs = buildInchMix();
function buildInchMix(): Job[] {
  const jobs: Job[] = [];
  for (const size of INCH_SIZES) for (const c of INCH_CLASS_NAMES) if (isInchFitDefined(size, c)) jobs.push({ size, text: c });
  return jobs;
}
const inchRate = run('inch class look-ups', inchJobs, (j) => inchFit(j.size, j.text).maxClearanceThou);

const TARGET = 1_000_000;
console.log(zoneRate >= TARGET ? `OK: zone look-ups above ${TARGET.toLocaleString('en-US')}/s` : `SLOW: zone look-ups below ${TARGET.toLocaleString('en-US')}/s`);
if (zoneRate < TARGET) process.exitCode = 1;
console.log(inchRate >= TARGET ? `OK: inch class look-ups above ${TARGET.toLocaleString('en-US')}/s` : `SLOW: inch class look-ups below ${TARGET.toLocaleString('en-US')}/s`);
if (inchRate < TARGET) process.exitCode = 1;
void fitRate;
