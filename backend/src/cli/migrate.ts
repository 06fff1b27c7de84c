import { loadConfig } from '../config';
import { createSequelize } from '../db/sequelize';
import { createMigrator } from '@veracast/database';

const config = loadConfig();
const sequelize = createSequelize(config);
const migrator = createMigrator(sequelize, console);
const direction = process.argv[2] === 'down' ? 'down' : 'up';
await (direction === 'down' ? migrator.down() : migrator.up());
await sequelize.close();
