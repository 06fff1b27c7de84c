export { createMigrator, type Migration, type MigrationContext } from './migrator';
export * from './demo';
