import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class MailMessageModel extends Model<InferAttributes<MailMessageModel>, InferCreationAttributes<MailMessageModel>> {
  declare id: CreationOptional<number>;
  declare fromAddress: string;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare receivedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    MailMessageModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        fromAddress: { type: DataTypes.STRING(320), allowNull: false },
        toAddress: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.STRING(998), allowNull: false },
        textBody: { type: DataTypes.TEXT('medium'), allowNull: false },
        receivedAt: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'mail_messages' },
    );
  }
}
