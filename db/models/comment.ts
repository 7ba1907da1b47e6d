import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';
import type { Entry } from './entry';
import type { Media } from './media';

/** A reader's comment on a published entry; a reply has a parent (one level only). */
export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<number>;
  declare entryId: ForeignKey<Entry['id']>;
  declare authorId: ForeignKey<User['id']>;
  declare parentId: ForeignKey<Comment['id']> | null;
  /** The clip and moment it is pinned to, if any. */
  declare mediaId: ForeignKey<Media['id']> | null;
  declare atMs: number | null;
  declare body: string;
  declare version: CreationOptional<number>;
  declare editedAt: CreationOptional<Date | null>;
  /** Deleted by its author: the text is gone, the row stays while replies hang from it. */
  declare deletedAt: CreationOptional<Date | null>;
  /** Hidden by the builder or an admin, with a reason; never destroyed. */
  declare hiddenAt: CreationOptional<Date | null>;
  declare hiddenById: ForeignKey<User['id']> | null;
  declare hiddenReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare author?: NonAttribute<User>;
  declare replies?: NonAttribute<Comment[]>;

  static initModel(sequelize: Sequelize): void {
    Comment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        atMs: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        body: { type: DataTypes.TEXT, allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        editedAt: { type: DataTypes.DATE, allowNull: true },
        deletedAt: { type: DataTypes.DATE, allowNull: true },
        hiddenAt: { type: DataTypes.DATE, allowNull: true },
        hiddenReason: { type: DataTypes.STRING(300), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'comments', modelName: 'Comment' },
    );
  }
}
