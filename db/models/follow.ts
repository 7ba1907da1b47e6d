import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';
import type { Project } from './project';

/** A member following a project (projectId) or a builder (builderId); exactly one is set. */
export class Follow extends Model<InferAttributes<Follow>, InferCreationAttributes<Follow>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare projectId: ForeignKey<Project['id']> | null;
  declare builderId: ForeignKey<User['id']> | null;
  /** Whether this follow sends an e-mail when a session is published. */
  declare mail: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare user?: NonAttribute<User>;
  declare project?: NonAttribute<Project>;
  declare builder?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    Follow.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        mail: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'follows', modelName: 'Follow' },
    );
  }
}
