// Seeds the invented demo scenario into an empty database. Usage: tsx db/seeders/seed.ts [--print]
import bcrypt from 'bcryptjs';
import { initModels, User, Project, ProjectMembership, ShopSession } from '../models';
import { seedDemoLog, uploadDemoMedia } from './demo-log';
import { closeSequelize } from '../connection';
import { slugify } from '../../lib/slug';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts';
import { seedDemoFollows } from './demo-follows';
import { seedDemoFlags } from './demo-flags';
import { seedDemoComments } from './demo-comments';
import { seedDemoCalculations } from './demo-calculations';

const PROJECTS = [
  {
    owner: 'builder',
    title: 'Cast-iron backplate for the 160 mm three-jaw chuck',
    summary:
      'A new backplate to carry a 160 mm three-jaw chuck on the old 1.5 in × 8 TPI spindle nose of the lean-to shop lathe. ' +
      'Session one: bore and screw-cut the plate to the spindle. Session two: turn the spigot to a close fit in the chuck’s recess, ' +
      'measuring as it approaches size. Session three: drill and tap three M8 holes on the bolt circle and counterbore the plate for ' +
      'socket head cap screws. A fourth session cuts a 36-tooth module 1.5 change gear on the dividing head.',
    units: 'mm',
    visibility: 'published',
    mentors: ['mentor'],
  },
  {
    owner: 'builder',
    title: 'Tailstock die holder (planning)',
    summary: 'Notes and sketches for a sliding die holder for the tailstock, for 13/16 in button dies. Not started yet.',
    units: 'in',
    visibility: 'private',
    mentors: [],
  },
] as const;

/** The backplate project's log, once: its files go through the upload service, so that must be running. */
async function seedLogIfEmpty(sequelize: ReturnType<typeof initModels>): Promise<void> {
  const project = await Project.findOne({ where: { slug: slugify(PROJECTS[0].title, 80) } });
  if (!project || (await ShopSession.count({ where: { projectId: project.id } })) > 0) return;
  const builder = await User.findOne({ where: { email: DEMO_ACCOUNTS[0].email } });
  const follower = await User.findOne({ where: { email: DEMO_ACCOUNTS[1].email } });
  if (!builder || !follower) return;
  if (!process.env.UPLOADTHING_INGEST_URL) {
    console.log('No upload service configured (UPLOADTHING_INGEST_URL): the demo log was not seeded.');
    return;
  }
  const media = await uploadDemoMedia();
  await sequelize.transaction((transaction) => seedDemoLog(project.id, builder.id, follower.id, media, transaction));
  console.log('Seeded the demo build log.');
}

async function main(): Promise<void> {
  const sequelize = initModels();
  if ((await User.count()) > 0) {
    console.log('Database already holds accounts: demo data not seeded again.');
    // A demo database made before addresses were verified: its demo accounts count as verified.
    await User.update({ emailVerifiedAt: new Date() }, { where: { email: DEMO_ACCOUNTS.map((a) => a.email), emailVerifiedAt: null } });
  } else {
    await sequelize.transaction(async (transaction) => {
      const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
      const ids: Record<string, number> = {};
      for (const a of DEMO_ACCOUNTS) {
        // Demo accounts are seeded with their addresses verified (the addresses are invented, nothing is sent).
        const u = await User.create(
          { name: a.name, email: a.email, handle: slugify(a.name, 30), passwordHash: hash, siteRole: a.siteRole, emailVerifiedAt: new Date() },
          { transaction },
        );
        ids[a.key] = u.id;
      }
      for (const p of PROJECTS) {
        const project = await Project.create(
          {
            ownerId: ids[p.owner],
            slug: slugify(p.title, 80),
            title: p.title,
            summary: p.summary,
            units: p.units,
            visibility: p.visibility,
            publishedAt: p.visibility === 'published' ? new Date() : null,
          },
          { transaction },
        );
        for (const m of p.mentors) await ProjectMembership.create({ projectId: project.id, userId: ids[m], role: 'mentor' }, { transaction });
      }
    });
    console.log('Seeded the demo accounts and projects.');
  }
  await seedLogIfEmpty(sequelize);
  await seedDemoFollows();
  await seedDemoFlags();
  await seedDemoComments();
  await seedDemoCalculations();
  if (process.argv.includes('--print')) {
    console.log('\nDemo accounts (password for all: ' + DEMO_PASSWORD + ')');
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.role.padEnd(9)} ${a.name.padEnd(14)} ${a.email}`);
  }
}

main()
  .catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exitCode = 1;
  })
  .finally(() => closeSequelize());
