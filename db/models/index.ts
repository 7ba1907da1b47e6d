import type { Sequelize } from 'sequelize';
import { getSequelize } from '../connection';
import { User } from './user';
import { Project } from './project';
import { ProjectMembership } from './project-membership';
import { SignInAttempt } from './sign-in-attempt';
import { ShopSession } from './shop-session';
import { Entry } from './entry';
import { Media } from './media';
import { TimeNote } from './time-note';
import { MeasurementRecord } from './measurement-record';
import { MeasurementReading } from './measurement-reading';
import { MeasurementPair } from './measurement-pair';
import { OutboxMessage } from './outbox-message';
import { Follow } from './follow';
import { Comment } from './comment';
import { MentorInvitation } from './mentor-invitation';
import { RiskFlag } from './risk-flag';

// Next may load this module twice (pages and route handlers are bundled apart): each copy
// initialises its own model classes against the one shared pool.
let initialisedWith: Sequelize | undefined;

export function initModels(): Sequelize {
  const sequelize = getSequelize();
  if (initialisedWith === sequelize) return sequelize;
  User.initModel(sequelize);
  Project.initModel(sequelize);
  ProjectMembership.initModel(sequelize);
  SignInAttempt.initModel(sequelize);
  ShopSession.initModel(sequelize);
  Entry.initModel(sequelize);
  Media.initModel(sequelize);
  TimeNote.initModel(sequelize);
  MeasurementRecord.initModel(sequelize);
  MeasurementReading.initModel(sequelize);
  MeasurementPair.initModel(sequelize);
  OutboxMessage.initModel(sequelize);
  Follow.initModel(sequelize);
  Comment.initModel(sequelize);
  MentorInvitation.initModel(sequelize);
  RiskFlag.initModel(sequelize);

  Project.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  User.hasMany(Project, { as: 'projects', foreignKey: 'ownerId' });
  Project.hasMany(ProjectMembership, { as: 'memberships', foreignKey: 'projectId' });
  ProjectMembership.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
  ProjectMembership.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Project.hasMany(ShopSession, { as: 'sessions', foreignKey: 'projectId' });
  ShopSession.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
  ShopSession.hasMany(Entry, { as: 'entries', foreignKey: 'sessionId' });
  Entry.belongsTo(ShopSession, { as: 'session', foreignKey: 'sessionId' });
  Entry.hasMany(Media, { as: 'media', foreignKey: 'entryId' });
  Media.belongsTo(Entry, { as: 'entry', foreignKey: 'entryId' });
  Media.hasMany(TimeNote, { as: 'notes', foreignKey: 'mediaId' });
  TimeNote.belongsTo(Media, { as: 'media', foreignKey: 'mediaId' });
  TimeNote.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Entry.hasMany(MeasurementRecord, { as: 'measurements', foreignKey: 'entryId' });
  MeasurementRecord.belongsTo(Entry, { as: 'entry', foreignKey: 'entryId' });
  MeasurementRecord.belongsTo(TimeNote, { as: 'timeNote', foreignKey: 'timeNoteId' });
  MeasurementRecord.hasMany(MeasurementReading, { as: 'readings', foreignKey: 'recordId' });
  MeasurementReading.belongsTo(MeasurementRecord, { as: 'record', foreignKey: 'recordId' });
  MeasurementPair.belongsTo(MeasurementRecord, { as: 'hole', foreignKey: 'holeRecordId' });
  MeasurementPair.belongsTo(MeasurementRecord, { as: 'shaft', foreignKey: 'shaftRecordId' });
  Follow.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Follow.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
  Follow.belongsTo(User, { as: 'builder', foreignKey: 'builderId' });
  Comment.belongsTo(Entry, { as: 'entry', foreignKey: 'entryId' });
  Comment.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Comment.belongsTo(Comment, { as: 'parent', foreignKey: 'parentId' });
  Comment.hasMany(Comment, { as: 'replies', foreignKey: 'parentId' });
  Comment.belongsTo(Media, { as: 'media', foreignKey: 'mediaId' });
  Comment.belongsTo(User, { as: 'hiddenBy', foreignKey: 'hiddenById' });
  Entry.hasMany(Comment, { as: 'comments', foreignKey: 'entryId' });
  MentorInvitation.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
  MentorInvitation.belongsTo(User, { as: 'invitedBy', foreignKey: 'invitedById' });
  MentorInvitation.belongsTo(User, { as: 'acceptedBy', foreignKey: 'acceptedById' });
  RiskFlag.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
  RiskFlag.belongsTo(ShopSession, { as: 'session', foreignKey: 'sessionId' });
  RiskFlag.belongsTo(Entry, { as: 'entry', foreignKey: 'entryId' });
  RiskFlag.belongsTo(TimeNote, { as: 'note', foreignKey: 'noteId' });
  RiskFlag.belongsTo(MeasurementRecord, { as: 'record', foreignKey: 'recordId' });
  RiskFlag.belongsTo(User, { as: 'mentor', foreignKey: 'mentorId' });
  initialisedWith = sequelize;
  return sequelize;
}

export { User, Project, ProjectMembership, SignInAttempt, ShopSession, Entry, Media, TimeNote, MeasurementRecord, MeasurementReading, MeasurementPair, OutboxMessage, Follow, Comment, MentorInvitation, RiskFlag };
