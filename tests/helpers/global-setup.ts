import { Sequelize } from 'sequelize';
import * as mariadb from 'mariadb';
import { loadConfig } from '../../backend/src/config';
import { testEnv } from './env';

/** Fails early, with a clear message, when MariaDB is not running (npm test starts it). */
export default async function setup() {
  const config = loadConfig(testEnv());
  const s = new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
    dialect: 'mariadb', dialectModule: mariadb, host: config.DB_HOST, port: config.DB_PORT, logging: false,
  });
  try {
    await s.authenticate();
  } catch (err) {
    throw new Error(`MariaDB is not reachable on ${config.DB_HOST}:${config.DB_PORT}; run the tests with "npm test" (which starts it).`, { cause: err });
  } finally {
    await s.close();
  }
}
