// Followers in the demo story: Tobias follows the backplate build; Wren, a second reader, follows
// its builder. Safe to run again: it only adds what is missing.
import bcrypt from 'bcryptjs';
import { Follow, Project, User } from '../models';
import { slugify } from '../../lib/slug';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts';

const BACKPLATE = 'Cast-iron backplate for the 160 mm three-jaw chuck';
export const SECOND_FOLLOWER = { name: 'Wren Talbot', email: 'wren@talbot-bench.test' } as const;

export async function seedDemoFollows(): Promise<void> {
  const builder = await User.findOne({ where: { email: DEMO_ACCOUNTS[0].email } });
  const tobias = await User.findOne({ where: { email: DEMO_ACCOUNTS[1].email } });
  const project = await Project.findOne({ where: { slug: slugify(BACKPLATE, 80) } });
  if (!builder || !tobias || !project) return;

  let wren = await User.findOne({ where: { email: SECOND_FOLLOWER.email } });
  if (!wren) {
    wren = await User.create({
      name: SECOND_FOLLOWER.name,
      email: SECOND_FOLLOWER.email,
      handle: slugify(SECOND_FOLLOWER.name, 30),
      passwordHash: await bcrypt.hash(DEMO_PASSWORD, 10),
      siteRole: 'member',
      emailVerifiedAt: new Date(),
    });
  }
  const [, a] = await Follow.findOrCreate({ where: { userId: tobias.id, projectId: project.id }, defaults: { userId: tobias.id, projectId: project.id, builderId: null, mail: true } });
  const [, b] = await Follow.findOrCreate({ where: { userId: wren.id, builderId: builder.id }, defaults: { userId: wren.id, builderId: builder.id, projectId: null, mail: true } });
  if (a || b) console.log('Seeded the demo follows.');
}
