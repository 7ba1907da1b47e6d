import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Media } from './media';
import type { User } from './user';

export const NOTE_KINDS = ['note', 'measurement', 'caution', 'question'] as const;
export type NoteKind = (typeof NOTE_KINDS)[number];

/** A note pinned to a moment (and optionally a span) of a clip. Times in milliseconds. */
export class TimeNote extends Model<InferAttributes<TimeNote>, InferCreationAttributes<TimeNote>> {
  declare id: CreationOptional<number>;
  declare mediaId: ForeignKey<Media['id']>;
  declare startMs: number;
  declare endMs: number | null;
  declare kind: NoteKind;
  declare text: string;
  declare authorId: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare media?: NonAttribute<Media>;
  declare author?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    TimeNote.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        startMs: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        endMs: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        kind: { type: DataTypes.STRING(12), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'time_notes', modelName: 'TimeNote' },
    );
  }
}
