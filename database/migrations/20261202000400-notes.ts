import { DataTypes, literal } from 'sequelize';
import type { Migration } from '../src/migrator';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') };
const fk = (model: string, allowNull: boolean, onDelete: string) => ({
  type: DataTypes.INTEGER.UNSIGNED, allowNull, references: { model, key: 'id' }, onDelete,
});

export const up: Migration['up'] = async ({ context: q }) => {
  await q.createTable('notes', {
    id,
    slug: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    title: { type: DataTypes.STRING(200), allowNull: false },
    author_id: fk('users', false, 'RESTRICT'),
    state: { type: DataTypes.ENUM('draft', 'in_review', 'published'), allowNull: false, defaultValue: 'draft' },
    current_version_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    published_version_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    election_key: { type: DataTypes.STRING(100), allowNull: true },
    published_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await q.addIndex('notes', ['state'], { name: 'notes_state' });
  await q.addIndex('notes', ['author_id'], { name: 'notes_author' });
  await q.createTable('note_versions', {
    id,
    note_id: fk('notes', false, 'CASCADE'),
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    markdown: { type: DataTypes.TEXT('medium'), allowNull: false },
    rendered_html: { type: DataTypes.TEXT('long'), allowNull: false },
    audit_ids: { type: DataTypes.TEXT, allowNull: false },
    data_hashes: { type: DataTypes.TEXT, allowNull: false },
    is_correction: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    correction_notice: { type: DataTypes.TEXT, allowNull: true },
    created_by_id: fk('users', true, 'SET NULL'),
    created_at: now,
  });
  await q.addIndex('note_versions', ['note_id', 'number'], { unique: true, name: 'note_versions_number' });
  await q.createTable('note_reviews', {
    id,
    note_id: fk('notes', false, 'CASCADE'),
    version_id: fk('note_versions', false, 'CASCADE'),
    reviewer_id: fk('users', true, 'SET NULL'),
    decision: { type: DataTypes.ENUM('approved', 'returned'), allowNull: false },
    comments: { type: DataTypes.TEXT, allowNull: true },
    created_at: now,
  });
  await q.addConstraint('notes', { type: 'foreign key', fields: ['current_version_id'], name: 'notes_current_version_fk', references: { table: 'note_versions', field: 'id' }, onDelete: 'SET NULL', onUpdate: 'CASCADE' });
  await q.addConstraint('notes', { type: 'foreign key', fields: ['published_version_id'], name: 'notes_published_version_fk', references: { table: 'note_versions', field: 'id' }, onDelete: 'SET NULL', onUpdate: 'CASCADE' });
  // Versions and review decisions are append-only: what was published, or said in a review, stays as it was.
  await q.sequelize.query(`CREATE TRIGGER note_versions_append_only BEFORE UPDATE ON note_versions FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'note versions are append-only'`);
  await q.sequelize.query(`CREATE TRIGGER note_reviews_append_only BEFORE UPDATE ON note_reviews FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'note reviews are append-only'`);
};

export const down: Migration['down'] = async ({ context: q }) => {
  await q.sequelize.query('DROP TRIGGER IF EXISTS note_versions_append_only');
  await q.sequelize.query('DROP TRIGGER IF EXISTS note_reviews_append_only');
  await q.removeConstraint('notes', 'notes_current_version_fk');
  await q.removeConstraint('notes', 'notes_published_version_fk');
  await q.dropTable('note_reviews');
  await q.dropTable('note_versions');
  await q.dropTable('notes');
};
