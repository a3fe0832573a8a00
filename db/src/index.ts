// Public surface of the database package: connection, migrations, demo seed and table types.
export { createDb } from './createDb.js';
export { isConnectionError } from './isConnectionError.js';
export { listenForNotifications } from './notificationListener.js';
export { ensureDatabase } from './ensureDatabase.js';
export { migrateToLatest, migrateDown, pendingMigrations } from './migrateToLatest.js';
export { DirMigrationProvider, MIGRATIONS_DIR } from './dirMigrationProvider.js';
export { seedDemo } from './seedDemo.js';
export { DEMO_DESIGNS } from './demoDesigns.js';
export {
  DEMO_PASSWORD,
  DEMO_USERS,
  DEMO_WORKSPACE_NAME,
  DEFAULT_WORKSPACE_SETTINGS,
} from './demoWorkspace.js';
export * from './schema.js';
