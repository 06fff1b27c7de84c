import * as mariadb from 'mariadb';
import { Sequelize } from 'sequelize';
import type { Config } from '../config';

/** One Sequelize instance per process (per test database in tests). */
export function createSequelize(config: Pick<Config, 'DB_HOST' | 'DB_PORT' | 'DB_NAME' | 'DB_USER' | 'DB_PASSWORD'>) {
  return new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
    dialect: 'mariadb',
    dialectModule: mariadb,
    host: config.DB_HOST,
    port: config.DB_PORT,
    timezone: '+00:00',
    logging: false,
    pool: { max: 10, min: 0, acquire: 5000, idle: 10000 },
    dialectOptions: { connectTimeout: 3000, permitLocalInfile: true, multipleStatements: false },
    define: { underscored: true, timestamps: false },
  });
}
