/**
 * Where each table and rule comes from, in the words the pages show beside a
 * result. "From memory" marks values written down from the published tables
 * without a copy at hand; "common practice" marks shop rules that no standard
 * fixes. Both are said openly so a builder knows what to check before cutting.
 */
export const SOURCES = {
  unifiedThreads: 'ASME B1.1 unified inch screw threads, UNC and UNF series — from memory',
  metricThreads: 'ISO 261 / ISO 262 ISO general purpose metric threads, coarse and fine pitches — from memory',
  threadForm: 'ISO 68-1 / ASME B1.1 basic profile: H = 0.866025·P, basic minor diameter of the nut D1 = D − 1.082532·P — from memory',
  threadPercent: "Machinery's Handbook, tap drill sizes and percentage of thread: % = (major − drill) / (1.299·P) × 100 — from memory",
  tapDepth: 'Blind-hole drilling allowance for taper, plug and bottoming taps — common practice',
  drills: 'ASME B94.11M twist drill sizes (fractional, number and letter); metric drills in the usual stocked steps — from memory',
  metricClearance: 'ISO 273 clearance holes for bolts and screws, fine / medium / coarse series — from memory',
  inchClearance: 'Inch close-fit and free-fit clearance drills as given in the usual shop tables — common practice, from memory',
  inchLooseClearance: 'Inch loose clearance: about 20 % over the screw size (like the ISO 273 coarse series), rounded up to the next inch drill — common practice',
  metricCapScrew: 'ISO 4762 socket head cap screws, head diameter dk max and head height k max — from memory',
  inchCapScrew: 'ASME B18.3 socket head cap screws (inch), head diameter A max and head height H max — from memory',
  metricCounterbore: 'DIN 974-1 counterbore diameters for ISO 4762 heads — from memory',
  inchCounterbore: 'ASME B18.3 appendix, drill and counterbore sizes for socket head cap screws — from memory',
  counterboreRule: 'Counterbore diameter = head diameter + about 10 %, rounded up to a whole millimetre — common practice',
  counterboreDepth: 'Counterbore depth = head height + 0.5 mm up to M10, + 1 mm above (inch: + 1/32 in up to 1/2 in, + 1/16 in above), so the head sits just below the surface — common practice',
  wall: 'Wall left beside a counterbore: at least 1.5 mm and at least 10 % of the head diameter — common practice',
  boltCircle: "Bolt-circle hole coordinates as in Machinery's Handbook hole-coordinate tables — from memory",
  indexPlates: 'Three index plates commonly supplied with a 40:1 dividing head (15–20, 21–33, 37–49 holes) — common practice',
  simpleIndexing: "Simple indexing: crank turns = ratio / divisions, Machinery's Handbook — from memory",
  differentialIndexing: "Machinery's Handbook, differential indexing — from memory",
  changeGears: 'Change gears commonly supplied for differential indexing: 24, 24, 28, 32, 40, 44, 48, 56, 64, 72, 86 teeth — common practice',
  directIndexing: 'Direct indexing on a spindle plate — common practice',
  gearsModule: 'ISO 53 basic rack (20°): addendum 1·m, dedendum 1.25·m, whole depth 2.25·m — from memory',
  gearsDiametralPitch: 'ANSI B6.1 coarse-pitch full-depth teeth (14.5° and 20°): addendum 1/P, dedendum 1.157/P, whole depth 2.157/P, as cut by the usual involute cutters — from memory',
  gearCutters: "Machinery's Handbook, involute gear cutter numbers 1–8 and the tooth counts each covers — from memory",
  spindleSpeed: 'rev/min = 1000·v / (π·d) with v in m/min and d in mm; rev/min = 12·v / (π·d) with v in ft/min and d in inches',
  cuttingSpeeds: 'Starting cutting speeds for turning and drilling — common practice, from memory',
} as const;
