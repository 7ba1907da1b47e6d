// The demo project's measurement records: the spigot turned toward size pass by pass against the
// chuck's recess (paired as a fit), the plate's bore, the tapped-hole depths and a thickness read in
// inches. Invented story, invented people; only the inputs are stored, as the app stores them.
import { Op, type InferCreationAttributes, type Transaction } from 'sequelize';
import { Entry, Media, MeasurementPair, MeasurementReading, MeasurementRecord, Project, ShopSession, TimeNote, User } from '../models';

type Reading = {
  value: string;
  unit?: 'mm' | 'in';
  instrument: string;
  resolution: string;
  at: string;
  pass?: number;
  temperatureC?: string;
  note?: string;
};

export async function seedDemoMeasurements(projectId: number, transaction: Transaction): Promise<void> {
  const project = await Project.findByPk(projectId, { transaction });
  if (!project) return;
  const builder = await User.findByPk(project.ownerId, { attributes: ['id', 'name'], transaction });
  const sessions = await ShopSession.findAll({ where: { projectId }, attributes: ['id'], transaction });
  const entries = await Entry.findAll({ where: { sessionId: { [Op.in]: sessions.map((s) => s.id) } }, attributes: ['id', 'title'], transaction });
  const entryTitled = (start: string) => entries.find((e) => e.title.startsWith(start));

  const record = async (
    entry: Entry | undefined,
    fields: Omit<InferCreationAttributes<MeasurementRecord>, 'entryId' | 'id' | 'version' | 'createdAt' | 'updatedAt'>,
    readings: Reading[],
  ): Promise<MeasurementRecord | null> => {
    if (!entry) return null;
    const r = await MeasurementRecord.create({ ...fields, entryId: entry.id }, { transaction });
    for (const [i, x] of readings.entries()) {
      await MeasurementReading.create(
        {
          recordId: r.id,
          position: i,
          passNumber: x.pass ?? null,
          value: x.value,
          unit: x.unit ?? 'mm',
          instrument: x.instrument,
          resolution: x.resolution,
          measuredBy: builder?.name ?? '',
          measuredAt: new Date(x.at),
          temperatureC: x.temperatureC ?? null,
          note: x.note ?? '',
        },
        { transaction },
      );
    }
    return r;
  };
  const none = { specZone: null, specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null };

  // Session 2: the spigot, pass by pass, opened at the clip's final-reading moment.
  const spigotEntry = entryTitled('Turning the spigot');
  let finalMoment: number | null = null;
  if (spigotEntry) {
    const clip = await Media.findOne({ where: { entryId: spigotEntry.id, kind: 'clip' }, attributes: ['id'], transaction });
    const notes = clip ? await TimeNote.findAll({ where: { mediaId: clip.id, kind: 'measurement' }, order: [['startMs', 'ASC']], transaction }) : [];
    finalMoment = (notes.find((n) => n.text.includes('130.012')) ?? notes[notes.length - 1])?.id ?? null;
  }
  const spigot = await record(
    spigotEntry,
    { feature: 'Spigot diameter', kind: 'outside', nominal: '130', unit: 'mm', specType: 'zone', ...none, specZone: 'k6', timeNoteId: finalMoment },
    [
      { value: '130.40', instrument: 'caliper', resolution: '0.01', at: '2026-10-10T09:40:00Z', pass: 1, note: 'After roughing the face and the diameter.' },
      { value: '130.100', instrument: 'micrometer', resolution: '0.001', at: '2026-10-10T10:25:00Z', pass: 2, temperatureC: '27', note: 'Plate still warm from roughing: let it cool before the finishing passes.' },
      { value: '130.030', instrument: 'micrometer', resolution: '0.001', at: '2026-10-10T11:20:00Z', pass: 3, temperatureC: '22', note: 'Over by 0.002 mm: took a 0.01 mm spring pass, see the final reading' },
      { value: '130.012', instrument: 'micrometer', resolution: '0.001', at: '2026-10-10T11:45:00Z', pass: 4, temperatureC: '21', note: 'Chuck goes on with a firm push and no shake.' },
    ],
  );
  const recess = await record(
    spigotEntry,
    { feature: 'Chuck recess (register bore)', kind: 'inside', nominal: '130', unit: 'mm', specType: 'zone', ...none, specZone: 'H7', timeNoteId: null },
    [{ value: '130.015', instrument: 'telescoping-gauge', resolution: '0.001', at: '2026-10-10T09:10:00Z', temperatureC: '20', note: 'Gauge set in the recess, read over the 125–150 mm micrometer.' }],
  );
  if (spigot && recess) await MeasurementPair.create({ holeRecordId: recess.id, shaftRecordId: spigot.id }, { transaction });

  // Session 1: the plate's bore, opened up to just over the thread's minor diameter.
  await record(
    entryTitled('Boring and screw-cutting'),
    { feature: 'Bore of the plate', kind: 'inside', nominal: '36.9', unit: 'mm', specType: 'limits', ...none, specUpper: '0.1', specLower: '0', timeNoteId: null },
    [
      { value: '36.86', instrument: 'caliper', resolution: '0.01', at: '2026-10-03T10:30:00Z', pass: 1, note: 'Under by 0.04 mm after roughing: one more pass with the boring bar.' },
      { value: '36.95', instrument: 'caliper', resolution: '0.01', at: '2026-10-03T11:05:00Z', pass: 2, temperatureC: '19' },
    ],
  );

  // Session 1: the faced thickness, read with an inch micrometer.
  await record(
    entryTitled('Facing the casting'),
    { feature: 'Plate thickness', kind: 'outside', nominal: '1.575', unit: 'in', specType: 'plusMinus', ...none, specTolerance: '0.002', timeNoteId: null },
    [{ value: '1.5745', unit: 'in', instrument: 'micrometer', resolution: '0.0001', at: '2026-10-03T09:15:00Z', temperatureC: '18', note: 'Read with the 1–2 in micrometer at three places round the rim; this is the thinnest.' }],
  );

  // Session 3: depth of the three tapped holes (general tolerance, medium class).
  await record(
    entryTitled('Tapping M8'),
    { feature: 'Tapped-hole depth, M8', kind: 'inside', nominal: '16', unit: 'mm', specType: 'general', ...none, specGeneralClass: 'm', timeNoteId: null },
    [
      { value: '16.10', instrument: 'caliper', resolution: '0.01', at: '2026-10-17T14:10:00Z', note: 'Hole 1, with the caliper’s depth rod.' },
      { value: '15.95', instrument: 'caliper', resolution: '0.01', at: '2026-10-17T14:12:00Z', note: 'Hole 2.' },
      { value: '16.05', instrument: 'caliper', resolution: '0.01', at: '2026-10-17T14:14:00Z', note: 'Hole 3.' },
    ],
  );
  await seedInchProjectMeasurement(project.ownerId, transaction);
}

/**
 * The builder's inch project (the tailstock die holder, still being planned) gets a trial arbor
 * turned to try the holder's sliding fit, specified as the shaft of an ANSI B4.1 class: 0.750 in RC4.
 */
async function seedInchProjectMeasurement(ownerId: number, transaction: Transaction): Promise<void> {
  const inchProject = await Project.findOne({ where: { ownerId, units: 'in' }, transaction });
  if (!inchProject || (await ShopSession.count({ where: { projectId: inchProject.id }, transaction })) > 0) return;
  const session = await ShopSession.create(
    {
      projectId: inchProject.id, position: 0, title: 'Trial arbor', heldOn: '2026-10-24', minutesSpent: 50,
      planned: 'Turn a trial arbor to try the sliding fit the die holder will run on.',
      done: 'Turned the arbor from 1 in mild steel bar and read it with the 0–1 in micrometer.',
      nextSteps: 'Bore the holder body to the hole side of the same class.',
    },
    { transaction },
  );
  const text = 'A short arbor to try the fit before the holder is made: the holder must slide along it freely but without shake, so the arbor is turned to the shaft side of RC4.';
  const entry = await Entry.create(
    { sessionId: session.id, position: 0, title: 'Turning the trial arbor', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] }) },
    { transaction },
  );
  const r = await MeasurementRecord.create(
    {
      entryId: entry.id, feature: 'Trial arbor for the die holder', kind: 'outside', nominal: '0.75', unit: 'in',
      specType: 'inchClass', specZone: 'RC4', specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null, timeNoteId: null,
    },
    { transaction },
  );
  const builder = await User.findByPk(ownerId, { attributes: ['name'], transaction });
  const readings = [
    { value: '0.7510', at: '2026-10-24T10:05:00Z', pass: 1, note: 'After roughing: 1.8 thou over the top limit.' },
    { value: '0.7488', at: '2026-10-24T10:30:00Z', pass: 2, note: 'Finishing pass with a fresh edge: inside, near the middle of the band.' },
  ];
  for (const [i, x] of readings.entries()) {
    await MeasurementReading.create(
      {
        recordId: r.id, position: i, passNumber: x.pass, value: x.value, unit: 'in', instrument: 'micrometer', resolution: '0.0001',
        measuredBy: builder?.name ?? '', measuredAt: new Date(x.at), temperatureC: '20', note: x.note,
      },
      { transaction },
    );
  }
}
