import { DataTypes, literal } from 'sequelize';
import type { Migration } from '../src/migrator';

export const up: Migration['up'] = async ({ context: q }) => {
  await q.createTable('audits', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    settings: { type: DataTypes.TEXT, allowNull: false },
    data_hash: { type: DataTypes.CHAR(64), allowNull: false },
    core_version: { type: DataTypes.STRING(40), allowNull: false },
    poll_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    summary: { type: DataTypes.TEXT('long'), allowNull: false },
    scorecards: { type: DataTypes.TEXT('long'), allowNull: true },
    shared_error: { type: DataTypes.TEXT('long'), allowNull: true },
    rerun_of_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'audits', key: 'id' }, onDelete: 'SET NULL' },
    created_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
  });
  await q.createTable('audit_polls', {
    audit_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true, references: { model: 'audits', key: 'id' }, onDelete: 'CASCADE' },
    poll_key: { type: DataTypes.STRING(100), allowNull: false, primaryKey: true },
    election_key: { type: DataTypes.STRING(100), allowNull: false },
    contest_key: { type: DataTypes.STRING(100), allowNull: false },
    pollster_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    in_window: { type: DataTypes.BOOLEAN, allowNull: false },
    is_final: { type: DataTypes.BOOLEAN, allowNull: false },
    abs_margin_error: { type: DataTypes.DOUBLE, allowNull: true },
    metrics: { type: DataTypes.TEXT('medium'), allowNull: false },
  });
  await q.addIndex('audit_polls', ['audit_id', 'election_key'], { name: 'audit_polls_election' });
  // Audits are frozen: the database refuses to change a stored audit or its per-poll metrics.
  await q.sequelize.query(`CREATE TRIGGER audits_frozen BEFORE UPDATE ON audits FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audits are frozen'`);
  await q.sequelize.query(`CREATE TRIGGER audit_polls_frozen BEFORE UPDATE ON audit_polls FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audits are frozen'`);
};

export const down: Migration['down'] = async ({ context: q }) => {
  await q.sequelize.query('DROP TRIGGER IF EXISTS audits_frozen');
  await q.sequelize.query('DROP TRIGGER IF EXISTS audit_polls_frozen');
  await q.dropTable('audit_polls');
  await q.dropTable('audits');
};
