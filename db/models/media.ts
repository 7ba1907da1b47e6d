import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Entry } from './entry';
import type { User } from './user';
import type { TimeNote } from './time-note';

export type MediaKind = 'photo' | 'clip';
export type MediaSource = 'upload' | 'link';

/** A photo or clip of an entry: a file that arrived at the upload service, or a link to a video elsewhere. */
export class Media extends Model<InferAttributes<Media>, InferCreationAttributes<Media>> {
  declare id: CreationOptional<number>;
  declare entryId: ForeignKey<Entry['id']>;
  declare kind: MediaKind;
  declare source: MediaSource;
  declare fileKey: string | null;
  declare url: string;
  declare name: string;
  declare mime: string | null;
  declare sizeBytes: number | null;
  declare width: number | null;
  declare height: number | null;
  declare durationMs: number | null;
  declare caption: CreationOptional<string>;
  declare position: CreationOptional<number>;
  declare uploadedBy: ForeignKey<User['id']> | null;
  /** The phone's own id for a photo or clip sent from the bench view (unique): a second delivery finds this row. */
  declare clientId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare entry?: NonAttribute<Entry>;
  declare notes?: NonAttribute<TimeNote[]>;

  static initModel(sequelize: Sequelize): void {
    Media.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.STRING(8), allowNull: false },
        source: { type: DataTypes.STRING(8), allowNull: false },
        fileKey: { type: DataTypes.STRING(200), allowNull: true, unique: true },
        url: { type: DataTypes.STRING(2048), allowNull: false },
        name: { type: DataTypes.STRING(255), allowNull: false },
        mime: { type: DataTypes.STRING(100), allowNull: true },
        // BIGINT comes back from MariaDB as a string: read it as a number (clips stay far below 2^53).
        sizeBytes: {
          type: DataTypes.BIGINT.UNSIGNED,
          allowNull: true,
          get(this: Media) {
            const v = this.getDataValue('sizeBytes') as unknown;
            return v === null || v === undefined ? null : Number(v);
          },
        },
        width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        durationMs: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        uploadedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        clientId: { type: DataTypes.STRING(64), allowNull: true, unique: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'media', modelName: 'Media' },
    );
  }
}
