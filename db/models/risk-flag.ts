import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';
import type { Project } from './project';
import type { ShopSession } from './shop-session';
import type { Entry } from './entry';
import type { TimeNote } from './time-note';
import type { MeasurementRecord } from './measurement-record';

export const FLAG_SEVERITIES = ['caution', 'warning', 'stop'] as const;
export type FlagSeverity = (typeof FLAG_SEVERITIES)[number];
export const FLAG_HAZARDS = [
  'rotating-work', 'flying-chips', 'dust-fumes', 'sharp-edges', 'lifting', 'electrical', 'part-breakage', 'tool-breakage', 'other',
] as const;
export type FlagHazard = (typeof FLAG_HAZARDS)[number];
export const FLAG_TARGETS = ['entry', 'note', 'measurement'] as const;
export type FlagTarget = (typeof FLAG_TARGETS)[number];
export const FLAG_STATUSES = ['open', 'acknowledged', 'resolved'] as const;
export type FlagStatus = (typeof FLAG_STATUSES)[number];

/** A mentor's risk flag. project, session and entry are kept on the row so banners and counts need no walk. */
export class RiskFlag extends Model<InferAttributes<RiskFlag>, InferCreationAttributes<RiskFlag>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare sessionId: ForeignKey<ShopSession['id']>;
  declare entryId: ForeignKey<Entry['id']>;
  declare targetKind: FlagTarget;
  declare noteId: ForeignKey<TimeNote['id']> | null;
  declare recordId: ForeignKey<MeasurementRecord['id']> | null;
  declare mentorId: ForeignKey<User['id']>;
  declare severity: FlagSeverity;
  declare hazard: FlagHazard;
  declare concern: string;
  declare instead: string;
  declare status: CreationOptional<FlagStatus>;
  declare acknowledgedAt: CreationOptional<Date | null>;
  declare resolvedAt: CreationOptional<Date | null>;
  declare answer: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare mentor?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    RiskFlag.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        targetKind: { type: DataTypes.STRING(12), allowNull: false },
        severity: { type: DataTypes.STRING(8), allowNull: false },
        hazard: { type: DataTypes.STRING(20), allowNull: false },
        concern: { type: DataTypes.TEXT, allowNull: false },
        instead: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'open' },
        acknowledgedAt: { type: DataTypes.DATE, allowNull: true },
        resolvedAt: { type: DataTypes.DATE, allowNull: true },
        answer: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'risk_flags', modelName: 'RiskFlag' },
    );
  }
}
