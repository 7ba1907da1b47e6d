import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Visibility } from '../../lib/types/visibility';
import type { Project } from './project';
import type { Entry } from './entry';

/** One day at the machines. */
export class ShopSession extends Model<InferAttributes<ShopSession>, InferCreationAttributes<ShopSession>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare position: number;
  declare title: string;
  declare heldOn: string; // YYYY-MM-DD
  declare minutesSpent: number;
  declare planned: string;
  declare done: string;
  declare nextSteps: string;
  declare visibility: CreationOptional<Visibility>;
  /** First time the session was set to published. */
  declare publishedAt: CreationOptional<Date | null>;
  /** When followers were told of it (once). */
  declare announcedAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare entries?: NonAttribute<Entry[]>;
  declare project?: NonAttribute<Project>;

  static initModel(sequelize: Sequelize): void {
    ShopSession.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        title: { type: DataTypes.STRING(120), allowNull: false },
        heldOn: { type: DataTypes.DATEONLY, allowNull: false },
        minutesSpent: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        planned: { type: DataTypes.TEXT, allowNull: false },
        done: { type: DataTypes.TEXT, allowNull: false },
        nextSteps: { type: DataTypes.TEXT, allowNull: false },
        visibility: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'private' },
        publishedAt: { type: DataTypes.DATE, allowNull: true },
        announcedAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'shop_sessions', modelName: 'ShopSession' },
    );
  }
}
