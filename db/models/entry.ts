import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ShopSession } from './shop-session';
import type { Media } from './media';
import { entryPlainText } from '../../lib/rich-text/plain-text';

export class Entry extends Model<InferAttributes<Entry>, InferCreationAttributes<Entry>> {
  declare id: CreationOptional<number>;
  declare sessionId: ForeignKey<ShopSession['id']>;
  declare position: number;
  declare title: string;
  declare operation: string;
  /** ProseMirror JSON, as text. */
  declare body: string;
  /** The body's words as plain text, for search: written here on every save of the body (same statement). */
  declare bodyText: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare session?: NonAttribute<ShopSession>;
  declare media?: NonAttribute<Media[]>;

  static initModel(sequelize: Sequelize): void {
    Entry.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        title: { type: DataTypes.STRING(120), allowNull: false },
        operation: { type: DataTypes.STRING(20), allowNull: false },
        body: { type: DataTypes.TEXT('long'), allowNull: false },
        bodyText: { type: DataTypes.TEXT('medium'), allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'entries',
        modelName: 'Entry',
        // Every write of a body, whoever makes it (routes, actions, seeders, imports), keeps its plain text beside it.
        hooks: {
          beforeSave: (entry) => {
            if (entry.isNewRecord || entry.changed('body')) entry.bodyText = entryPlainText(entry.body);
          },
          beforeBulkCreate: (entries) => {
            for (const entry of entries) entry.bodyText = entryPlainText(entry.body);
          },
          beforeBulkUpdate: (options) => {
            const values = (options as { attributes?: { body?: string; bodyText?: string } }).attributes ?? {};
            if (values.body !== undefined) {
              values.bodyText = entryPlainText(values.body);
              if (options.fields && !options.fields.includes('bodyText')) options.fields.push('bodyText');
            }
          },
        },
      },
    );
  }
}
