import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Entry } from './entry';
import type { User } from './user';

/** A calculator result kept in an entry. inputs/outputs are JSON text; they are parsed in lib/server. */
export class SavedCalculation extends Model<InferAttributes<SavedCalculation>, InferCreationAttributes<SavedCalculation>> {
  declare id: CreationOptional<number>;
  declare entryId: ForeignKey<Entry['id']>;
  declare calculator: string;
  declare label: string;
  declare inputs: string;
  declare outputs: string;
  declare tablesVersion: string;
  declare position: CreationOptional<number>;
  declare createdById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    SavedCalculation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        calculator: { type: DataTypes.STRING(24), allowNull: false },
        label: { type: DataTypes.STRING(120), allowNull: false },
        inputs: { type: DataTypes.TEXT, allowNull: false },
        outputs: { type: DataTypes.TEXT('medium'), allowNull: false },
        tablesVersion: { type: DataTypes.STRING(20), allowNull: false },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'saved_calculations', modelName: 'SavedCalculation' },
    );
  }
}
