import { DataTypes, literal } from 'sequelize';
import type { Migration } from '../src/migrator';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') };
const fk = (model: string, allowNull = false, onDelete = 'CASCADE') => ({
  type: DataTypes.INTEGER.UNSIGNED, allowNull, references: { model, key: 'id' }, onDelete,
});

export const up: Migration['up'] = async ({ context: q }) => {
  await q.createTable('elections', {
    id,
    key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    election_date: { type: DataTypes.DATEONLY, allowNull: false },
    jurisdiction: { type: DataTypes.STRING(120), allowNull: false },
    bloc_a: { type: DataTypes.STRING(60), allowNull: true },
    bloc_b: { type: DataTypes.STRING(60), allowNull: true },
    blackout_start: { type: DataTypes.DATEONLY, allowNull: true },
    blackout_end: { type: DataTypes.DATEONLY, allowNull: true },
    fictional: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: now,
    updated_at: now,
  });
  await q.createTable('contests', {
    id,
    election_id: fk('elections'),
    key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    kind: { type: DataTypes.ENUM('candidate', 'referendum'), allowNull: false, defaultValue: 'candidate' },
    result_status: { type: DataTypes.ENUM('provisional', 'certified'), allowNull: true },
    certified_on: { type: DataTypes.DATEONLY, allowNull: true },
    certifying_body: { type: DataTypes.STRING(200), allowNull: true },
    source_url: { type: DataTypes.STRING(500), allowNull: true },
    source_doc_name: { type: DataTypes.STRING(200), allowNull: true },
    source_doc: { type: DataTypes.BLOB('medium'), allowNull: true },
    rejected_ballots: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
    electorate: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await q.createTable('options', {
    id,
    contest_id: fk('contests'),
    key: { type: DataTypes.STRING(100), allowNull: false },
    name: { type: DataTypes.STRING(200), allowNull: false },
    bloc: { type: DataTypes.STRING(60), allowNull: true },
    votes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
  });
  await q.addIndex('options', ['contest_id', 'key'], { unique: true, name: 'options_contest_key' });

  await q.createTable('pollsters', {
    id,
    name: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    created_at: now,
  });
  await q.createTable('pollster_aliases', {
    id,
    pollster_id: fk('pollsters'),
    alias: { type: DataTypes.STRING(200), allowNull: false },
    normalized: { type: DataTypes.STRING(200), allowNull: false, unique: true },
  });
  await q.createTable('sponsors', {
    id,
    name: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    type: { type: DataTypes.ENUM('media', 'academic', 'party', 'campaign', 'advocacy', 'self', 'unknown'), allowNull: false, defaultValue: 'unknown' },
  });
  await q.createTable('imports', {
    id,
    kind: { type: DataTypes.ENUM('results', 'polls'), allowNull: false },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    file_hash: { type: DataTypes.CHAR(64), allowNull: false },
    user_id: fk('users', true, 'SET NULL'),
    status: { type: DataTypes.ENUM('committed', 'dry_run', 'failed'), allowNull: false },
    rows: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    updated: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    unchanged: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    skipped: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    error_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    errors: { type: DataTypes.TEXT('long'), allowNull: true },
    valid_only: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: now,
  });
  await q.createTable('polls', {
    id,
    key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    pollster_id: fk('pollsters', false, 'RESTRICT'),
    sponsor_id: fk('sponsors', true, 'SET NULL'),
    contest_id: fk('contests', false, 'RESTRICT'),
    fieldwork_start: { type: DataTypes.DATEONLY, allowNull: false },
    fieldwork_end: { type: DataTypes.DATEONLY, allowNull: false },
    published_on: { type: DataTypes.DATEONLY, allowNull: false },
    sample_size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    population: { type: DataTypes.ENUM('lv', 'rv', 'a'), allowNull: false },
    mode: { type: DataTypes.ENUM('phone', 'ivr', 'online', 'text', 'mixed', 'face', 'mail'), allowNull: false },
    moe: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
    study_key: { type: DataTypes.STRING(100), allowNull: true },
    is_headline: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    tracking: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    source_url: { type: DataTypes.STRING(500), allowNull: true },
    question_wording: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    weighting_statement: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    tables_url: { type: DataTypes.STRING(500), allowNull: true },
    import_id: fk('imports', true, 'SET NULL'),
    created_at: now,
    updated_at: now,
  });
  await q.addIndex('polls', ['contest_id', 'fieldwork_end'], { name: 'polls_contest_end' });
  await q.addIndex('polls', ['pollster_id'], { name: 'polls_pollster' });
  await q.createTable('poll_shares', {
    poll_id: { ...fk('polls'), primaryKey: true },
    option_key: { type: DataTypes.STRING(100), allowNull: false, primaryKey: true },
    share: { type: DataTypes.DECIMAL(6, 3), allowNull: false },
  });
  await q.createTable('change_log', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    entity: { type: DataTypes.STRING(40), allowNull: false },
    entity_key: { type: DataTypes.STRING(100), allowNull: false },
    action: { type: DataTypes.STRING(40), allowNull: false },
    user_id: fk('users', true, 'SET NULL'),
    reason: { type: DataTypes.TEXT, allowNull: true },
    before_value: { type: DataTypes.TEXT('long'), allowNull: true },
    after_value: { type: DataTypes.TEXT('long'), allowNull: true },
    created_at: now,
  });
  await q.addIndex('change_log', ['entity', 'entity_key'], { name: 'change_log_entity' });
  // Append-only: the database itself refuses to rewrite history.
  await q.sequelize.query(`CREATE TRIGGER change_log_no_update BEFORE UPDATE ON change_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'change_log is append-only'`);
  await q.sequelize.query(`CREATE TRIGGER change_log_no_delete BEFORE DELETE ON change_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'change_log is append-only'`);
};

export const down: Migration['down'] = async ({ context: q }) => {
  await q.sequelize.query('DROP TRIGGER IF EXISTS change_log_no_update');
  await q.sequelize.query('DROP TRIGGER IF EXISTS change_log_no_delete');
  for (const t of ['change_log', 'poll_shares', 'polls', 'imports', 'sponsors', 'pollster_aliases', 'pollsters', 'options', 'contests', 'elections']) {
    await q.dropTable(t);
  }
};
