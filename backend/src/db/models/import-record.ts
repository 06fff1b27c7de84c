import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class ImportModel extends Model<InferAttributes<ImportModel>, InferCreationAttributes<ImportModel>> {
  declare id: CreationOptional<number>;
  declare kind: 'results' | 'polls';
  declare fileName: string;
  declare fileHash: string;
  declare userId: number | null;
  declare status: 'committed' | 'dry_run' | 'failed';
  declare rows: CreationOptional<number>;
  declare created: CreationOptional<number>;
  declare updated: CreationOptional<number>;
  declare unchanged: CreationOptional<number>;
  declare skipped: CreationOptional<number>;
  declare errorCount: CreationOptional<number>;
  declare errors: CreationOptional<string | null>;
  declare validOnly: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ImportModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.ENUM('results', 'polls'), allowNull: false },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        fileHash: { type: DataTypes.CHAR(64), allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        status: { type: DataTypes.ENUM('committed', 'dry_run', 'failed'), allowNull: false },
        rows: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        created: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        updated: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        unchanged: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        skipped: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        errorCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        errors: { type: DataTypes.TEXT('long'), allowNull: true },
        validOnly: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'imports', timestamps: true, updatedAt: false },
    );
  }
}

export class ChangeLogModel extends Model<InferAttributes<ChangeLogModel>, InferCreationAttributes<ChangeLogModel>> {
  declare id: CreationOptional<number>;
  declare entity: string;
  declare entityKey: string;
  declare action: string;
  declare userId: number | null;
  declare reason: string | null;
  declare beforeValue: string | null;
  declare afterValue: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ChangeLogModel.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true, get() { return Number(this.getDataValue('id')); } },
        entity: { type: DataTypes.STRING(40), allowNull: false },
        entityKey: { type: DataTypes.STRING(100), allowNull: false },
        action: { type: DataTypes.STRING(40), allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        reason: { type: DataTypes.TEXT, allowNull: true },
        beforeValue: { type: DataTypes.TEXT('long'), allowNull: true },
        afterValue: { type: DataTypes.TEXT('long'), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'change_log', timestamps: true, updatedAt: false },
    );
  }
}
