import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';
import type { Project } from './project';

/** An invitation to mentor a project, sent by e-mail; accepted once, before it expires, by that address. */
export class MentorInvitation extends Model<InferAttributes<MentorInvitation>, InferCreationAttributes<MentorInvitation>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare email: string;
  declare invitedById: ForeignKey<User['id']>;
  /** SHA-256 of the random part of the link: the database alone cannot forge a link. */
  declare nonceHash: string;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedById: ForeignKey<User['id']> | null;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare project?: NonAttribute<Project>;
  declare invitedBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    MentorInvitation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        nonceHash: { type: DataTypes.CHAR(64), allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'mentor_invitations', modelName: 'MentorInvitation' },
    );
  }
}
