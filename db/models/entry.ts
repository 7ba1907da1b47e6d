import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ShopSession } from './shop-session';
import type { Media } from './media';

export class Entry extends Model<InferAttributes<Entry>, InferCreationAttributes<Entry>> {
  declare id: CreationOptional<number>;
  declare sessionId: ForeignKey<ShopSession['id']>;
  declare position: number;
  declare title: string;
  declare operation: string;
  /** ProseMirror JSON, as text. */
  declare body: string;
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
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'entries', modelName: 'Entry' },
    );
  }
}
