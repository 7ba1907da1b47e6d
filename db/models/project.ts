import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';
import type { ProjectMembership } from './project-membership';

import type { LengthUnit } from '../../lib/types/units';
import type { Visibility } from '../../lib/types/visibility';

export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<number>;
  declare ownerId: ForeignKey<User['id']>;
  declare slug: string;
  declare title: string;
  declare summary: string;
  declare units: LengthUnit;
  declare visibility: Visibility;
  declare publishedAt: Date | null;
  declare version: CreationOptional<number>;
  /** The client-made id of the request that created it (see createProjectOnce), and a hash of what it asked. */
  declare createRequestId: CreationOptional<string | null>;
  declare createRequestHash: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare owner?: NonAttribute<User>;
  declare memberships?: NonAttribute<ProjectMembership[]>;

  static initModel(sequelize: Sequelize): void {
    Project.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        slug: { type: DataTypes.STRING(90), allowNull: false, unique: true },
        title: { type: DataTypes.STRING(120), allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        units: { type: DataTypes.STRING(2), allowNull: false, defaultValue: 'mm' },
        visibility: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'private' },
        publishedAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createRequestId: { type: DataTypes.STRING(100), allowNull: true },
        createRequestHash: { type: DataTypes.CHAR(64), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'projects', modelName: 'Project' },
    );
  }
}
