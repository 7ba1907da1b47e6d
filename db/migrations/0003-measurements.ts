import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };
const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
const fk = (table: string, allowNull = false, onDelete: 'CASCADE' | 'SET NULL' = 'CASCADE') => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
});
// Lengths as typed, exactly: up to 5 decimals of a millimetre or an inch. Limits, deviations and
// verdicts are computed from these by lib/measurements and never stored.
const length = (allowNull = false) => ({ type: DataTypes.DECIMAL(12, 5), allowNull });

export async function up({ context: qi }: Ctx): Promise<void> {
  // A critical dimension of an entry: the feature, its nominal size and its specification.
  await qi.createTable('measurement_records', {
    id,
    entry_id: fk('entries'),
    // The clip moment where it was measured; the record stays when the note goes.
    time_note_id: fk('time_notes', true, 'SET NULL'),
    feature: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(8), allowNull: false }, // outside | inside
    nominal: length(),
    unit: { type: DataTypes.STRING(2), allowNull: false }, // mm | in
    spec_type: { type: DataTypes.STRING(10), allowNull: false }, // zone | limits | plusMinus | general
    spec_zone: { type: DataTypes.STRING(6), allowNull: true },
    spec_upper: length(true),
    spec_lower: length(true),
    spec_tolerance: length(true),
    spec_general_class: { type: DataTypes.STRING(1), allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...stamps,
  });
  await qi.addIndex('measurement_records', ['entry_id']);

  await qi.createTable('measurement_readings', {
    id,
    record_id: fk('measurement_records'),
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    pass_number: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
    value: length(),
    unit: { type: DataTypes.STRING(2), allowNull: false },
    instrument: { type: DataTypes.STRING(20), allowNull: false },
    resolution: length(),
    measured_by: { type: DataTypes.STRING(120), allowNull: false },
    measured_at: { type: DataTypes.DATE, allowNull: false },
    temperature_c: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
    // What the builder did about it, e.g. for a reading outside its limits.
    note: { type: DataTypes.TEXT, allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...stamps,
  });
  await qi.addIndex('measurement_readings', ['record_id', 'position']);

  // A hole record and a shaft record of the same nominal size, judged as a fit.
  await qi.createTable('measurement_pairs', {
    id,
    hole_record_id: fk('measurement_records'),
    shaft_record_id: fk('measurement_records'),
    ...stamps,
  });
  await qi.addIndex('measurement_pairs', ['hole_record_id', 'shaft_record_id'], { unique: true, name: 'measurement_pairs_hole_shaft' });
  await qi.addIndex('measurement_pairs', ['shaft_record_id']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('measurement_pairs');
  await qi.dropTable('measurement_readings');
  await qi.dropTable('measurement_records');
}
