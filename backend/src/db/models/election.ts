import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class ElectionModel extends Model<InferAttributes<ElectionModel>, InferCreationAttributes<ElectionModel>> {
  declare id: CreationOptional<number>;
  declare key: string;
  declare name: string;
  declare electionDate: string;
  declare jurisdiction: string;
  declare blocA: CreationOptional<string | null>;
  declare blocB: CreationOptional<string | null>;
  declare blackoutStart: CreationOptional<string | null>;
  declare blackoutEnd: CreationOptional<string | null>;
  declare fictional: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ElectionModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        electionDate: { type: DataTypes.DATEONLY, allowNull: false },
        jurisdiction: { type: DataTypes.STRING(120), allowNull: false },
        blocA: { type: DataTypes.STRING(60), allowNull: true },
        blocB: { type: DataTypes.STRING(60), allowNull: true },
        blackoutStart: { type: DataTypes.DATEONLY, allowNull: true },
        blackoutEnd: { type: DataTypes.DATEONLY, allowNull: true },
        fictional: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'elections', timestamps: true },
    );
  }
}
