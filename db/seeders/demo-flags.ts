// The mentor's part of the demo story: Agnes flags the first run of the new backplate on its spindle
// (Edda has acknowledged it, not yet answered), and a caution on the spigot measurement that Edda has
// answered. Edda has also invited a second mentor to her private die-holder plan. Invented people and
// words. Safe to run again: it only adds what is missing.
import { createHash, randomBytes } from 'node:crypto';
import { Entry, MeasurementRecord, MentorInvitation, Project, ProjectMembership, RiskFlag, ShopSession, User } from '../models';
import { slugify } from '../../lib/slug';
import { DEMO_ACCOUNTS } from './demo-accounts';

const BACKPLATE = 'Cast-iron backplate for the 160 mm three-jaw chuck';
const DIE_HOLDER = 'Tailstock die holder (planning)';
export const INVITED_MENTOR_EMAIL = 'oswin@hartle-workshop.test';

const DAY = 24 * 60 * 60 * 1000;

export async function seedDemoFlags(): Promise<void> {
  const builder = await User.findOne({ where: { email: DEMO_ACCOUNTS[0].email } });
  const mentor = await User.findOne({ where: { email: DEMO_ACCOUNTS[2].email } });
  const backplate = await Project.findOne({ where: { slug: slugify(BACKPLATE, 80) } });
  if (!builder || !mentor || !backplate) return;
  if (!(await ProjectMembership.count({ where: { projectId: backplate.id, userId: mentor.id, role: 'mentor' } }))) return;

  if (!(await RiskFlag.count({ where: { projectId: backplate.id } }))) {
    const sessions = await ShopSession.findAll({ where: { projectId: backplate.id }, attributes: ['id'] });
    const entries = await Entry.findAll({ where: { sessionId: sessions.map((s) => s.id) }, attributes: ['id', 'sessionId', 'title'] });
    // The first run of the plate on the spindle happens in the spigot-turning entry.
    const spigot = entries.find((e) => e.title.startsWith('Turning the spigot'));
    if (spigot) {
      const base = { projectId: backplate.id, sessionId: spigot.sessionId, entryId: spigot.id, mentorId: mentor.id };
      await RiskFlag.create({
        ...base,
        targetKind: 'entry',
        noteId: null,
        recordId: null,
        severity: 'warning',
        hazard: 'rotating-work',
        concern:
          'This is the first time the new plate runs on the spindle. A plate that is not fully seated against the spindle shoulder can shift or ' +
          'unscrew when the spindle starts or brakes, and a chuck key left in the chuck is thrown at the first turn.',
        instead:
          'Before the first start, check the plate is fully seated against the spindle shoulder and the chuck key is out. Turn the spindle ' +
          'through a full turn by hand, start at the lowest speed, and stand clear of the line of the chuck.',
        status: 'acknowledged',
        acknowledgedAt: new Date(),
        version: 2,
      });
      const record = await MeasurementRecord.findOne({ where: { entryId: spigot.id, feature: 'Spigot diameter' }, attributes: ['id'] });
      if (record) {
        await RiskFlag.create({
          ...base,
          targetKind: 'measurement',
          noteId: null,
          recordId: record.id,
          severity: 'caution',
          hazard: 'rotating-work',
          concern:
            'The photo shows the micrometer on the spigot with the lathe still live at the wall. A knock on the start lever with both hands ' +
            'round the work would be nasty.',
          instead: 'Stop the spindle and switch off at the isolator before each reading, and wind the carriage clear of your knuckles.',
          status: 'resolved',
          acknowledgedAt: new Date(),
          resolvedAt: new Date(),
          answer:
            'Fair point. I now switch off at the isolator before every reading and wind the carriage back; the last two readings were taken that way.',
          version: 3,
        });
      }
      console.log('Seeded the demo risk flags.');
    }
  }

  const dieHolder = await Project.findOne({ where: { slug: slugify(DIE_HOLDER, 80) } });
  if (dieHolder && !(await MentorInvitation.count({ where: { projectId: dieHolder.id } }))) {
    // Nobody holds this link: the row stands for an invitation waiting in someone's inbox.
    await MentorInvitation.create({
      projectId: dieHolder.id,
      email: INVITED_MENTOR_EMAIL,
      invitedById: builder.id,
      nonceHash: createHash('sha256').update(randomBytes(32).toString('base64url')).digest('hex'),
      expiresAt: new Date(Date.now() + 5 * DAY),
    });
    console.log('Seeded a pending mentor invitation.');
  }
}
