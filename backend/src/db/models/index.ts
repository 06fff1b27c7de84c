import type { Sequelize } from 'sequelize';
import { UserModel } from './user';
import { InvitationModel } from './invitation';
import { PasswordResetModel } from './password-reset';
import { ApiTokenModel } from './api-token';
import { MailMessageModel } from './mail-message';

export { UserModel, InvitationModel, PasswordResetModel, ApiTokenModel, MailMessageModel };

const initialisers: Array<(s: Sequelize) => void> = [
  (s) => UserModel.initModel(s),
  (s) => InvitationModel.initModel(s),
  (s) => PasswordResetModel.initModel(s),
  (s) => ApiTokenModel.initModel(s),
  (s) => MailMessageModel.initModel(s),
];

/** Binds every model class to this Sequelize instance. */
export function initModels(sequelize: Sequelize) {
  for (const init of initialisers) init(sequelize);
}
