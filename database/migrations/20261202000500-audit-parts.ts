import { DataTypes } from 'sequelize';
import type { Migration } from '../src/migrator';

/**
 * An audit's large stored results, one row per part: the scorecards (part_key '') and the
 * shared-error analysis of each election (part_key = election key). Each part is written by its
 * own INSERT, so no statement carries every election's analysis at once (the connector fails on
 * statements over 16 MiB). audits.scorecards and audits.shared_error stay for audits stored before.
 */
export const up: Migration['up'] = async ({ context: q }) => {
  await q.createTable('audit_parts', {
    audit_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true, references: { model: 'audits', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.ENUM('scorecards', 'shared_error'), allowNull: false, primaryKey: true },
    part_key: { type: DataTypes.STRING(100), allowNull: false, primaryKey: true, defaultValue: '' },
    payload: { type: DataTypes.TEXT('long'), allowNull: false },
  });
  // Audits are frozen: the database refuses to change a stored part.
  await q.sequelize.query(`CREATE TRIGGER audit_parts_frozen BEFORE UPDATE ON audit_parts FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audits are frozen'`);
};

export const down: Migration['down'] = async ({ context: q }) => {
  await q.sequelize.query('DROP TRIGGER IF EXISTS audit_parts_frozen');
  await q.dropTable('audit_parts');
};
