import type { Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import type { Config } from '../config';
import type { Mailer } from '../services/mail';

/** What every route needs, built once by the server (or by a test) and passed to createApp. */
export interface AppContext {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  logger: Logger;
}
