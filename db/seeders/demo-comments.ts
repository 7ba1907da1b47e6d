// Readers' comments in the demo story: Tobias asks, at a moment of the spigot clip, how the diameter was
// measured, and Edda answers; Wren (or, without Wren, Agnes) leaves a word on cast-iron dust.
// Safe to run again: it adds the comments only when the spigot entry has none.
import { Comment, Entry, Media, Project, ShopSession, User } from '../models';
import { slugify } from '../../lib/slug';
import { DEMO_ACCOUNTS } from './demo-accounts';
import { SECOND_FOLLOWER } from './demo-follows';

const BACKPLATE = 'Cast-iron backplate for the 160 mm three-jaw chuck';
const SPIGOT_ENTRY = 'Turning the spigot toward size';

const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000);

export async function seedDemoComments(): Promise<void> {
  const project = await Project.findOne({ where: { slug: slugify(BACKPLATE, 80) } });
  if (!project) return;
  const entry = await Entry.findOne({
    where: { title: SPIGOT_ENTRY },
    include: [{ model: ShopSession, as: 'session', attributes: [], required: true, where: { projectId: project.id } }],
  });
  if (!entry || (await Comment.count({ where: { entryId: entry.id } })) > 0) return;
  const clip = await Media.findOne({ where: { entryId: entry.id, kind: 'clip' }, order: [['position', 'ASC']] });
  const [edda, tobias, agnes] = await Promise.all(DEMO_ACCOUNTS.slice(0, 3).map((a) => User.findOne({ where: { email: a.email } })));
  const wren = await User.findOne({ where: { email: SECOND_FOLLOWER.email } });
  if (!edda || !tobias || !clip) return;

  // Created one by one with their own times, so the thread reads in the order it was written.
  const question = await Comment.create({
    entryId: entry.id,
    authorId: tobias.id,
    parentId: null,
    mediaId: clip.id,
    // Just after the final reading: the micrometer is on the spigot here.
    atMs: Math.min(9_000, clip.durationMs ?? 9_000),
    body:
      'How did you measure the spigot diameter at this point: one reading, or several around it? ' +
      'My 125–150 mm micrometer rocks on a short spigot and I never trust the first number.',
    createdAt: minutesAgo(3 * 24 * 60),
  });
  await Comment.create({
    entryId: entry.id,
    authorId: edda.id,
    parentId: question.id,
    mediaId: null,
    atMs: null,
    body:
      'Several. I checked the micrometer on its 125 mm setting standard first, then read the spigot at three places ' +
      'around it and at both ends of its width, rocking gently across the anvil until the reading stopped changing. ' +
      'All six agreed within 0.004 mm (0.00016 in); the clip shows the last of them: 130.012 mm (5.1186 in) at 21 °C.',
    createdAt: minutesAgo(3 * 24 * 60 - 95),
  });
  const reader = wren ?? agnes;
  if (reader) {
    await Comment.create({
      entryId: entry.id,
      authorId: reader.id,
      parentId: null,
      mediaId: null,
      atMs: null,
      body:
        'A tidy finish for cast iron. One thing I learned the hard way: the grey dust gets into the cross-slide ways, ' +
        'so I keep a vacuum nozzle near the tool and wear a mask rather than blow the bed clean with air.',
      createdAt: minutesAgo(2 * 24 * 60),
    });
  }
  console.log('Seeded the demo comments.');
}
