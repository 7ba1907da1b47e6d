import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { LengthUnit } from '../../lib/types/units';
import type { MeasurementRecord } from './measurement-record';

/** One value read off an instrument, as typed, with how and when it was taken. */
export class MeasurementReading extends Model<InferAttributes<MeasurementReading>, InferCreationAttributes<MeasurementReading>> {
  declare id: CreationOptional<number>;
  declare recordId: ForeignKey<MeasurementRecord['id']>;
  declare position: number;
  declare passNumber: number | null;
  declare value: string;
  declare unit: LengthUnit;
  declare instrument: string;
  declare resolution: string;
  declare measuredBy: string;
  declare measuredAt: Date;
  declare temperatureC: string | null;
  declare note: string;
  /** The phone's own id for a reading sent from the bench view (unique): a second delivery finds this row. */
  declare clientId: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare record?: NonAttribute<MeasurementRecord>;

  static initModel(sequelize: Sequelize): void {
    MeasurementReading.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        passNumber: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        value: { type: DataTypes.DECIMAL(12, 5), allowNull: false },
        unit: { type: DataTypes.STRING(2), allowNull: false },
        instrument: { type: DataTypes.STRING(20), allowNull: false },
        resolution: { type: DataTypes.DECIMAL(12, 5), allowNull: false },
        measuredBy: { type: DataTypes.STRING(120), allowNull: false },
        measuredAt: { type: DataTypes.DATE, allowNull: false },
        temperatureC: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: false },
        clientId: { type: DataTypes.STRING(64), allowNull: true, unique: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'measurement_readings', modelName: 'MeasurementReading' },
    );
  }
}
