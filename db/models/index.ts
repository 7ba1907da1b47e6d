import type { Sequelize } from 'sequelize';
import { getSequelize } from '../connection';
import { User } from './user';
import { Project } from './project';
import { ProjectMembership } from './project-membership';
import { SignInAttempt } from './sign-in-attempt';

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

  Project.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  User.hasMany(Project, { as: 'projects', foreignKey: 'ownerId' });
  Project.hasMany(ProjectMembership, { as: 'memberships', foreignKey: 'projectId' });
  ProjectMembership.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
  ProjectMembership.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  initialisedWith = sequelize;
  return sequelize;
}

export { User, Project, ProjectMembership, SignInAttempt };
