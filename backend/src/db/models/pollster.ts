import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { SponsorType } from '@veracast/shared-types';

export class PollsterModel extends Model<InferAttributes<PollsterModel>, InferCreationAttributes<PollsterModel>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare notes: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PollsterModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'pollsters', timestamps: true, updatedAt: false },
    );
  }
}

export class PollsterAliasModel extends Model<InferAttributes<PollsterAliasModel>, InferCreationAttributes<PollsterAliasModel>> {
  declare id: CreationOptional<number>;
  declare pollsterId: number;
  declare alias: string;
  declare normalized: string;

  static initModel(sequelize: Sequelize) {
    PollsterAliasModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        pollsterId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        alias: { type: DataTypes.STRING(200), allowNull: false },
        normalized: { type: DataTypes.STRING(200), allowNull: false, unique: true },
      },
      { sequelize, tableName: 'pollster_aliases' },
    );
  }
}

export class SponsorModel extends Model<InferAttributes<SponsorModel>, InferCreationAttributes<SponsorModel>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare type: CreationOptional<SponsorType>;

  static initModel(sequelize: Sequelize) {
    SponsorModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        type: { type: DataTypes.ENUM('media', 'academic', 'party', 'campaign', 'advocacy', 'self', 'unknown'), allowNull: false, defaultValue: 'unknown' },
      },
      { sequelize, tableName: 'sponsors' },
    );
  }
}
