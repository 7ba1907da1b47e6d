import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { LengthUnit } from '../../lib/types/units';
import type { Entry } from './entry';
import type { TimeNote } from './time-note';
import type { MeasurementReading } from './measurement-reading';

/**
 * A measured feature of an entry. Lengths are DECIMAL columns, which the driver hands back as
 * strings: lib/server/measurements converts them. Only inputs are stored; limits and verdicts are computed.
 */
export class MeasurementRecord extends Model<InferAttributes<MeasurementRecord>, InferCreationAttributes<MeasurementRecord>> {
  declare id: CreationOptional<number>;
  declare entryId: ForeignKey<Entry['id']>;
  declare timeNoteId: ForeignKey<TimeNote['id']> | null;
  declare feature: string;
  declare kind: 'outside' | 'inside';
  declare nominal: string;
  declare unit: LengthUnit;
  declare specType: 'zone' | 'inchClass' | 'limits' | 'plusMinus' | 'general';
  declare specZone: string | null;
  declare specUpper: string | null;
  declare specLower: string | null;
  declare specTolerance: string | null;
  declare specGeneralClass: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare readings?: NonAttribute<MeasurementReading[]>;
  declare entry?: NonAttribute<Entry>;
  declare timeNote?: NonAttribute<TimeNote | null>;

  static initModel(sequelize: Sequelize): void {
    MeasurementRecord.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        timeNoteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        feature: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(8), allowNull: false },
        nominal: { type: DataTypes.DECIMAL(12, 5), allowNull: false },
        unit: { type: DataTypes.STRING(2), allowNull: false },
        specType: { type: DataTypes.STRING(10), allowNull: false },
        specZone: { type: DataTypes.STRING(6), allowNull: true },
        specUpper: { type: DataTypes.DECIMAL(12, 5), allowNull: true },
        specLower: { type: DataTypes.DECIMAL(12, 5), allowNull: true },
        specTolerance: { type: DataTypes.DECIMAL(12, 5), allowNull: true },
        specGeneralClass: { type: DataTypes.STRING(1), allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'measurement_records', modelName: 'MeasurementRecord' },
    );
  }
}
