import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ContestKind, ResultStatus } from '@veracast/shared-types';

export class ContestModel extends Model<InferAttributes<ContestModel>, InferCreationAttributes<ContestModel>> {
  declare id: CreationOptional<number>;
  declare electionId: number;
  declare key: string;
  declare name: string;
  declare kind: CreationOptional<ContestKind>;
  declare resultStatus: CreationOptional<ResultStatus | null>;
  declare certifiedOn: CreationOptional<string | null>;
  declare certifyingBody: CreationOptional<string | null>;
  declare sourceUrl: CreationOptional<string | null>;
  declare sourceDocName: CreationOptional<string | null>;
  declare sourceDoc: CreationOptional<Buffer | null>;
  declare rejectedBallots: CreationOptional<number | null>;
  declare electorate: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ContestModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        electionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        kind: { type: DataTypes.ENUM('candidate', 'referendum'), allowNull: false, defaultValue: 'candidate' },
        resultStatus: { type: DataTypes.ENUM('provisional', 'certified'), allowNull: true },
        certifiedOn: { type: DataTypes.DATEONLY, allowNull: true },
        certifyingBody: { type: DataTypes.STRING(200), allowNull: true },
        sourceUrl: { type: DataTypes.STRING(500), allowNull: true },
        sourceDocName: { type: DataTypes.STRING(200), allowNull: true },
        sourceDoc: { type: DataTypes.BLOB('medium'), allowNull: true },
        rejectedBallots: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true, get() { const v = this.getDataValue('rejectedBallots'); return v == null ? null : Number(v); } },
        electorate: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true, get() { const v = this.getDataValue('electorate'); return v == null ? null : Number(v); } },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'contests', timestamps: true },
    );
  }
}
