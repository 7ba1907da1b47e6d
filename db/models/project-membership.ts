import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';
import type { Project } from './project';

// A per-project role a builder grants. Mentor is the one role so far; invitations come later.
export const PROJECT_ROLES = ['mentor'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export class ProjectMembership extends Model<InferAttributes<ProjectMembership>, InferCreationAttributes<ProjectMembership>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare userId: ForeignKey<User['id']>;
  declare role: ProjectRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    ProjectMembership.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        role: { type: DataTypes.STRING(16), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'project_memberships', modelName: 'ProjectMembership' },
    );
  }
}
