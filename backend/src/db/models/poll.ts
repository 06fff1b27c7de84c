import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Mode, Population } from '@veracast/shared-types';

export class PollModel extends Model<InferAttributes<PollModel>, InferCreationAttributes<PollModel>> {
  declare id: CreationOptional<number>;
  declare key: string;
  declare pollsterId: number;
  declare sponsorId: number | null;
  declare contestId: number;
  declare fieldworkStart: string;
  declare fieldworkEnd: string;
  declare publishedOn: string;
  declare sampleSize: number;
  declare population: Population;
  declare mode: Mode;
  declare moe: number | null;
  declare studyKey: string | null;
  declare isHeadline: CreationOptional<boolean>;
  declare tracking: CreationOptional<boolean>;
  declare sourceUrl: string | null;
  declare questionWording: CreationOptional<boolean>;
  declare weightingStatement: CreationOptional<boolean>;
  declare tablesUrl: string | null;
  declare importId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PollModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
        pollsterId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sponsorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        contestId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        fieldworkStart: { type: DataTypes.DATEONLY, allowNull: false },
        fieldworkEnd: { type: DataTypes.DATEONLY, allowNull: false },
        publishedOn: { type: DataTypes.DATEONLY, allowNull: false },
        sampleSize: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        population: { type: DataTypes.ENUM('lv', 'rv', 'a'), allowNull: false },
        mode: { type: DataTypes.ENUM('phone', 'ivr', 'online', 'text', 'mixed', 'face', 'mail'), allowNull: false },
        moe: { type: DataTypes.DECIMAL(5, 2), allowNull: true, get() { const v = this.getDataValue('moe'); return v == null ? null : Number(v); } },
        studyKey: { type: DataTypes.STRING(100), allowNull: true },
        isHeadline: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        tracking: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        sourceUrl: { type: DataTypes.STRING(500), allowNull: true },
        questionWording: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        weightingStatement: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        tablesUrl: { type: DataTypes.STRING(500), allowNull: true },
        importId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'polls', timestamps: true },
    );
  }
}

export class PollShareModel extends Model<InferAttributes<PollShareModel>, InferCreationAttributes<PollShareModel>> {
  declare pollId: number;
  declare optionKey: string;
  declare share: number;

  static initModel(sequelize: Sequelize) {
    PollShareModel.init(
      {
        pollId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        optionKey: { type: DataTypes.STRING(100), allowNull: false, primaryKey: true },
        share: { type: DataTypes.DECIMAL(6, 3), allowNull: false, get() { return Number(this.getDataValue('share')); } },
      },
      { sequelize, tableName: 'poll_shares' },
    );
  }
}
