import type { Sequelize } from 'sequelize';
import { UserModel } from './user';
import { InvitationModel } from './invitation';
import { PasswordResetModel } from './password-reset';
import { ApiTokenModel } from './api-token';
import { MailMessageModel } from './mail-message';
import { ElectionModel } from './election';
import { ContestModel } from './contest';
import { OptionModel } from './option';
import { PollsterModel, PollsterAliasModel, SponsorModel } from './pollster';
import { PollModel, PollShareModel } from './poll';
import { ImportModel, ChangeLogModel } from './import-record';
import { NoteModel, NoteVersionModel, NoteReviewModel } from './note';

export { UserModel, InvitationModel, PasswordResetModel, ApiTokenModel, MailMessageModel };
export { ElectionModel, ContestModel, OptionModel, PollsterModel, PollsterAliasModel, SponsorModel, PollModel, PollShareModel, ImportModel, ChangeLogModel };
export { NoteModel, NoteVersionModel, NoteReviewModel };

const initialisers: Array<(s: Sequelize) => void> = [
  (s) => UserModel.initModel(s),
  (s) => InvitationModel.initModel(s),
  (s) => PasswordResetModel.initModel(s),
  (s) => ApiTokenModel.initModel(s),
  (s) => MailMessageModel.initModel(s),
  (s) => ElectionModel.initModel(s),
  (s) => ContestModel.initModel(s),
  (s) => OptionModel.initModel(s),
  (s) => PollsterModel.initModel(s),
  (s) => PollsterAliasModel.initModel(s),
  (s) => SponsorModel.initModel(s),
  (s) => PollModel.initModel(s),
  (s) => PollShareModel.initModel(s),
  (s) => ImportModel.initModel(s),
  (s) => ChangeLogModel.initModel(s),
  (s) => NoteModel.initModel(s),
  (s) => NoteVersionModel.initModel(s),
  (s) => NoteReviewModel.initModel(s),
];

/** Binds every model class to this Sequelize instance. */
export function initModels(sequelize: Sequelize) {
  for (const init of initialisers) init(sequelize);
}
