import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';
import type { Comment } from './comment';

/** A member's report of a comment to the admins; dismissed or answered by hiding the comment. */
export class CommentReport extends Model<InferAttributes<CommentReport>, InferCreationAttributes<CommentReport>> {
  declare id: CreationOptional<number>;
  declare commentId: ForeignKey<Comment['id']>;
  declare reporterId: ForeignKey<User['id']>;
  declare reason: string;
  declare dismissedAt: CreationOptional<Date | null>;
  declare dismissedById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare comment?: NonAttribute<Comment>;
  declare reporter?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    CommentReport.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reason: { type: DataTypes.STRING(300), allowNull: false },
        dismissedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'comment_reports', modelName: 'CommentReport' },
    );
  }
}
