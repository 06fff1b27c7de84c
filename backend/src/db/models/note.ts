import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { NoteReviewDecision, NoteState } from '@veracast/shared-types';

/** A methodology note; its text lives in append-only versions. */
export class NoteModel extends Model<InferAttributes<NoteModel>, InferCreationAttributes<NoteModel>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare title: string;
  declare authorId: number;
  declare state: CreationOptional<NoteState>;
  declare currentVersionId: CreationOptional<number | null>;
  declare publishedVersionId: CreationOptional<number | null>;
  declare electionKey: string | null;
  declare publishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NoteModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        slug: { type: DataTypes.STRING(120), allowNull: false, unique: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        state: { type: DataTypes.ENUM('draft', 'in_review', 'published'), allowNull: false, defaultValue: 'draft' },
        currentVersionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        publishedVersionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        electionKey: { type: DataTypes.STRING(100), allowNull: true },
        publishedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'notes', timestamps: true },
    );
  }
}

/** One saved state of a note: never updated once written. */
export class NoteVersionModel extends Model<InferAttributes<NoteVersionModel>, InferCreationAttributes<NoteVersionModel>> {
  declare id: CreationOptional<number>;
  declare noteId: number;
  declare number: number;
  declare title: string;
  declare markdown: string;
  declare renderedHtml: string;
  /** JSON array of the audit ids the version's blocks cite. */
  declare auditIds: string;
  /** JSON object: audit id → the data hash stored with that audit. */
  declare dataHashes: string;
  declare isCorrection: CreationOptional<boolean>;
  declare correctionNotice: CreationOptional<string | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NoteVersionModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        noteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        markdown: { type: DataTypes.TEXT('medium'), allowNull: false },
        renderedHtml: { type: DataTypes.TEXT('long'), allowNull: false },
        auditIds: { type: DataTypes.TEXT, allowNull: false },
        dataHashes: { type: DataTypes.TEXT, allowNull: false },
        isCorrection: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        correctionNotice: { type: DataTypes.TEXT, allowNull: true },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'note_versions', timestamps: true, updatedAt: false },
    );
  }
}

/** A reviewer's decision on one version: approved (and published) or returned with comments. */
export class NoteReviewModel extends Model<InferAttributes<NoteReviewModel>, InferCreationAttributes<NoteReviewModel>> {
  declare id: CreationOptional<number>;
  declare noteId: number;
  declare versionId: number;
  declare reviewerId: number | null;
  declare decision: NoteReviewDecision;
  declare comments: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NoteReviewModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        noteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        versionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        reviewerId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        decision: { type: DataTypes.ENUM('approved', 'returned'), allowNull: false },
        comments: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'note_reviews', timestamps: true, updatedAt: false },
    );
  }
}
