import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { MeasurementRecord } from './measurement-record';

/** A hole record and a shaft record of the same nominal size, judged together as a fit. */
export class MeasurementPair extends Model<InferAttributes<MeasurementPair>, InferCreationAttributes<MeasurementPair>> {
  declare id: CreationOptional<number>;
  declare holeRecordId: ForeignKey<MeasurementRecord['id']>;
  declare shaftRecordId: ForeignKey<MeasurementRecord['id']>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare hole?: NonAttribute<MeasurementRecord>;
  declare shaft?: NonAttribute<MeasurementRecord>;

  static initModel(sequelize: Sequelize): void {
    MeasurementPair.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'measurement_pairs', modelName: 'MeasurementPair' },
    );
  }
}
