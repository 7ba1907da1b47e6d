// The demo project's build log: sessions, formatted entries, photos and a clip uploaded through the
// upload SDK's server API, and timestamped notes of every kind. Invented story, invented people.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { imageSize } from 'image-size';
import { UTApi, UTFile } from 'uploadthing/server';
import type { Transaction } from 'sequelize';
import { Entry, Media, ShopSession, TimeNote } from '../models';
import { seedDemoMeasurements } from './demo-measurements';
import { moveUploadsToAppUrls } from '../media-urls';

export { seedDemoMeasurements };

type Doc = Record<string, unknown>;
const t = (text: string, marks?: string[]) => ({ type: 'text', text, ...(marks ? { marks: marks.map((m) => ({ type: m })) } : {}) });
const p = (...content: unknown[]) => ({ type: 'paragraph', content });
const h = (level: number, text: string) => ({ type: 'heading', attrs: { level }, content: [t(text)] });
const ul = (...items: string[]) => ({ type: 'bulletList', content: items.map((i) => ({ type: 'listItem', content: [p(t(i))] })) });
const ol = (...items: string[]) => ({ type: 'orderedList', attrs: { start: 1 }, content: items.map((i) => ({ type: 'listItem', content: [p(t(i))] })) });
const quote = (text: string) => ({ type: 'blockquote', content: [p(t(text))] });
const img = (src: string, alt: string) => ({ type: 'image', attrs: { src, alt, title: null } });
const doc = (...content: unknown[]): Doc => ({ type: 'doc', content });

type Uploaded = { key: string; url: string; name: string; size: number; mime: string; width: number | null; height: number | null };

const MEDIA_DIR = path.join(__dirname, 'media');
const MIME: Record<string, string> = { '.jpg': 'image/jpeg', '.png': 'image/png', '.mp4': 'video/mp4' };

async function upload(utapi: UTApi, file: string): Promise<Uploaded> {
  const bytes = await readFile(path.join(MEDIA_DIR, file));
  const mime = MIME[path.extname(file)]!;
  const result = await utapi.uploadFiles(new UTFile([bytes], file, { type: mime }), { acl: 'private' });
  if (result.error) throw new Error(`Could not upload demo file ${file}: ${result.error.message}`);
  const dims = mime.startsWith('image/') ? imageSize(bytes) : null;
  return { key: result.data.key, url: result.data.ufsUrl, name: file, size: bytes.length, mime, width: dims?.width ?? null, height: dims?.height ?? null };
}

export async function uploadDemoMedia(): Promise<Record<string, Uploaded>> {
  const utapi = new UTApi({ logLevel: 'Error' });
  const files = ['backplate-section.jpg', 'spigot-measuring.jpg', 'bolt-circle-layout.png', 'spigot-turning.mp4'];
  const out: Record<string, Uploaded> = {};
  // The SDK warns about its own deprecated result fields on every upload; keep the start-up output readable.
  const warn = console.warn;
  console.warn = (...args: unknown[]) => {
    if (!String(args[0]).includes('[uploadthing][deprecated]')) warn(...args);
  };
  try {
    for (const f of files) out[f] = await upload(utapi, f);
  } finally {
    console.warn = warn;
  }
  return out;
}

export async function seedDemoLog(projectId: number, builderId: number, followerId: number, media: Record<string, Uploaded>, transaction: Transaction): Promise<void> {
  let sessionPos = 0;
  const session = (title: string, heldOn: string, minutesSpent: number, planned: string, done: string, nextSteps: string) =>
    ShopSession.create({ projectId, position: sessionPos++, title, heldOn, minutesSpent, planned, done, nextSteps, visibility: 'published', publishedAt: new Date(), announcedAt: new Date() }, { transaction });
  const entry = (sessionId: number, position: number, title: string, operation: string, body: Doc) =>
    Entry.create({ sessionId, position, title, operation, body: JSON.stringify(body) }, { transaction });
  const attach = (entryId: number, file: string, kind: 'photo' | 'clip', caption: string, position: number, durationMs: number | null = null) => {
    const m = media[file]!;
    return Media.create(
      { entryId, kind, source: 'upload', fileKey: m.key, url: m.url, name: m.name, mime: m.mime, sizeBytes: m.size, width: m.width, height: m.height, durationMs, caption, position, uploadedBy: builderId },
      { transaction },
    );
  };

  const s1 = await session(
    'Bore and thread the plate to the spindle nose',
    '2026-10-03',
    210,
    'Face the casting both sides, bore to the thread’s minor diameter, screw-cut 1½ in × 8 TPI to fit the spindle nose.',
    'Faced both sides to 40.0 mm. Bored and screw-cut; the plate runs up to the spindle register by hand.',
    'Turn the spigot to fit the chuck’s recess, with the plate on its own spindle.',
  );
  const section = media['backplate-section.jpg']!;
  const e11 = await entry(s1.id, 0, 'Facing the casting and checking for flaws', 'facing', doc(
    h(2, 'The blank'),
    p(t('A 200 mm grey-iron casting from the club’s scrap shelf, 42 mm thick. I faced the back first, '), t('taking light cuts', ['bold']), t(' to get under the scale without chipping the edge.')),
    img(section.url, 'Section sketch of the backplate'),
    h(3, 'What I checked'),
    ul('No blow holes showed on either face after the first 0.5 mm.', 'A hard spot near the rim: slowed to 180 rpm and it cut cleanly.', 'Final thickness 40.0 mm, flat within 0.02 mm across the face.'),
    quote('Cast-iron dust gets everywhere: vacuum it up, don’t blow it off with air, and wear a mask.'),
  ));
  await attach(e11.id, 'backplate-section.jpg', 'photo', 'Section sketch: bore, thread and spigot', 0);
  await entry(s1.id, 1, 'Boring and screw-cutting 1½ × 8 TPI', 'threading', doc(
    p(t('Bored to 36.9 mm, just over the thread’s minor diameter, then set the gearbox for 8 TPI. The '), t('spindle nose', ['italic']), t(' itself is the gauge, so I took the plate off in its chuck to try it between passes.')),
    ol('Set the topslide at 29½° and the tool square with a thread gauge.', 'Took 0.10 mm passes, then 0.05 mm, then two spring passes.', 'Tried the fit on the spindle after each pass from 0.6 mm depth onward.'),
    p(t('Thread depth at the end: '), t('0.80 mm', ['code']), t(' on the compound dial.')),
  ));

  const s2 = await session(
    'Turning the spigot to fit the chuck recess',
    '2026-10-10',
    180,
    'Turn the spigot to a close locating fit in the chuck’s 130 mm recess (hole basis, H7 recess; aim for a transition fit on the spigot).',
    'Reached size in four passes; the chuck goes on with a firm push and no shake.',
    'Drill and tap the three M8 holes on the bolt circle and counterbore the plate.',
  );
  const e21 = await entry(s2.id, 0, 'Turning the spigot toward size', 'turning', doc(
    p(t('With the plate screwed onto its own spindle, everything is concentric with the spindle by construction. I turned the spigot in passes and measured after each one.')),
    h(3, 'Passes'),
    ul('130.40 → 130.10 mm: roughing, 0.15 mm per side.', '130.10 → 130.03 mm: half the remaining stock.', '130.03 → 130.012 mm: a light finishing pass with a fresh edge.'),
    p(t('The clip shows the last passes and the micrometer reading; the notes beside it mark each step.')),
  ));
  const clip = await attach(e21.id, 'spigot-turning.mp4', 'clip', 'Last passes on the spigot', 0, 12_000);
  await attach(e21.id, 'spigot-measuring.jpg', 'photo', 'Measuring the spigot with the 125–150 mm micrometer', 1);
  const note = (startMs: number, endMs: number | null, kind: 'note' | 'measurement' | 'caution' | 'question', text: string, authorId = builderId) =>
    TimeNote.create({ mediaId: clip.id, startMs, endMs, kind, text, authorId }, { transaction });
  await note(0, 4_000, 'note', 'Facing the spigot face with a sharp round-nose tool');
  await note(4_000, 8_000, 'measurement', 'Pass 3: spigot at 130.03 mm, 0.02 mm still to come off the diameter');
  await note(6_500, null, 'caution', 'Chuck key out and guard down before every restart');
  await note(8_000, null, 'measurement', 'Final reading 130.012 mm with the plate at 21 °C');
  await note(10_000, null, 'question', 'How did you hold the micrometer square to the spigot here?', followerId);

  const s3 = await session(
    'Drill, tap and counterbore for the chuck screws',
    '2026-10-17',
    150,
    'Lay out three M8 holes on the 124 mm bolt circle, drill 6.8 mm, tap M8, counterbore from the back for socket head cap screws.',
    'Holes drilled and tapped; counterbores to 14 mm × 8.6 mm deep.',
    'Cut the 36-tooth change gear on the dividing head.',
  );
  const e31 = await entry(s3.id, 0, 'Laying out and drilling the bolt circle', 'drilling', doc(
    p(t('Three holes, 120° apart, on a 124 mm circle. I set the rotary table under the drill and centred it on the plate’s bore.')),
    img(media['bolt-circle-layout.png']!.url, 'Three M8 holes on a 124 mm bolt circle'),
    ul('Centre drill, then 6.8 mm through.', 'Clamped the plate to the table: a drill that grabs in cast iron can spin the work.'),
  ));
  await attach(e31.id, 'bolt-circle-layout.png', 'photo', 'Hole layout: three M8 at 120°', 0);
  await entry(s3.id, 1, 'Tapping M8 × 1.25', 'tapping', doc(
    p(t('Tapped by hand from the drill press spindle to keep the tap square: taper tap first, then a plug tap. Cast iron taps dry; I cleared the chips every turn.')),
  ));

  const s4 = await session(
    'Cutting the 36-tooth change gear',
    '2026-10-24',
    240,
    'Turn a 57 mm blank and cut 36 teeth, module 1.5, on the dividing head.',
    'Blank turned; half the teeth cut before the light went.',
    'Finish the teeth and deburr.',
  );
  await entry(s4.id, 0, 'Setting up the dividing head', 'indexing', doc(
    p(t('40:1 head: one full turn of the crank and two holes on the 18-hole circle for each tooth. Sector arms set to span two holes.')),
  ));

  await seedDemoMeasurements(projectId, transaction);
  // Pages and bodies show uploads through the app's own file address, never the service's.
  await moveUploadsToAppUrls(Entry.sequelize!, transaction);
}
