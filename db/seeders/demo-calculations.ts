// The builder's saved calculations in the demo backplate project: the M8 holes (tap drill, the
// engagement of the 6.8 mm drill, clearance hole and counterbore), the bolt circle they sit on, and
// the gear session's indexing and blank. Invented story. Safe to run again: it only adds what is missing.
import { Entry, Project, SavedCalculation, ShopSession, User } from '../models';
import { runCalculator, TABLES_VERSION, type CalculatorInputs, type CalculatorKind } from '../../lib/calculators';
import { defaultLabel } from '../../lib/calculators/pages/registry';
import { slugify } from '../../lib/slug';
import { DEMO_ACCOUNTS } from './demo-accounts';

const BACKPLATE = 'Cast-iron backplate for the 160 mm three-jaw chuck';

type Demo = { [K in CalculatorKind]: { entry: string; kind: K; input: CalculatorInputs[K]; label?: string } }[CalculatorKind];

// The plate is turned to about 160 mm: holes on the 124 mm bolt circle sit 18 mm in from its rim.
const DEMOS: Demo[] = [
  { entry: 'Laying out and drilling the bolt circle', kind: 'bolt-circle', input: { diameterMm: 124, holes: 3, startAngleDeg: 90 }, label: 'Bolt circle of the three M8 holes' },
  { entry: 'Laying out and drilling the bolt circle', kind: 'clearance-hole', input: { size: 'M8', fit: 'normal' } },
  {
    entry: 'Laying out and drilling the bolt circle',
    kind: 'counterbore',
    input: { size: 'M8', fit: 'normal', holeCentreToEdgeMm: 18 },
    label: 'Counterbore for the M8 chuck screws, 18 mm in from the rim',
  },
  { entry: 'Tapping M8 × 1.25', kind: 'tap-drill', input: { designation: 'M8x1.25', targetPercent: 75 } },
  { entry: 'Tapping M8 × 1.25', kind: 'thread-percent', input: { designation: 'M8x1.25', drillDiameterMm: 6.8 }, label: 'Engagement of the 6.8 mm drill in M8x1.25' },
  { entry: 'Setting up the dividing head', kind: 'simple-indexing', input: { divisions: 36, ratio: 40 }, label: 'Indexing 36 teeth on the 40:1 head' },
  { entry: 'Setting up the dividing head', kind: 'spur-gear', input: { teeth: 36, module: 1.5, pressureAngleDeg: 20 }, label: 'Blank for the 36-tooth module 1.5 gear' },
];

export async function seedDemoCalculations(): Promise<void> {
  const builder = await User.findOne({ where: { email: DEMO_ACCOUNTS[0].email } });
  const project = await Project.findOne({ where: { slug: slugify(BACKPLATE, 80) } });
  if (!builder || !project) return;
  const sessions = await ShopSession.findAll({ where: { projectId: project.id }, attributes: ['id'] });
  if (!sessions.length) return;
  const entries = await Entry.findAll({ where: { sessionId: sessions.map((s) => s.id) }, attributes: ['id', 'title'] });
  let added = 0;
  for (const demo of DEMOS) {
    const entry = entries.find((e) => e.title === demo.entry);
    if (!entry) continue;
    const output = runCalculator(demo.kind, demo.input as never);
    const label = demo.label ?? defaultLabel(demo.kind, demo.input as never, output as never);
    if (await SavedCalculation.count({ where: { entryId: entry.id, calculator: demo.kind, label } })) continue;
    const last = ((await SavedCalculation.max('position', { where: { entryId: entry.id } })) as number | null) ?? -1;
    await SavedCalculation.create({
      entryId: entry.id,
      calculator: demo.kind,
      label,
      inputs: JSON.stringify(demo.input),
      outputs: JSON.stringify(output),
      tablesVersion: TABLES_VERSION,
      position: last + 1,
      createdById: builder.id,
    });
    added++;
  }
  if (added) console.log(`Seeded ${added} demo saved calculations.`);
}
