import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class OptionModel extends Model<InferAttributes<OptionModel>, InferCreationAttributes<OptionModel>> {
  declare id: CreationOptional<number>;
  declare contestId: number;
  declare key: string;
  declare name: string;
  declare bloc: CreationOptional<string | null>;
  declare votes: CreationOptional<number | null>;

  static initModel(sequelize: Sequelize) {
    OptionModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        contestId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        key: { type: DataTypes.STRING(100), allowNull: false },
        name: { type: DataTypes.STRING(200), allowNull: false },
        bloc: { type: DataTypes.STRING(60), allowNull: true },
        votes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true, get() { const v = this.getDataValue('votes'); return v == null ? null : Number(v); } },
      },
      { sequelize, tableName: 'options' },
    );
  }
}
