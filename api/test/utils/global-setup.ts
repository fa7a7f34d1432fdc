import { applyTestEnv, databaseSettingsFromEnv } from './test-env.js';
import { runMigrations } from './migrate.js';

/** Once before all test files: bring the test database's schema up to date through the migrations. */
export default async function globalSetup(): Promise<void> {
  applyTestEnv();
  await runMigrations(databaseSettingsFromEnv());
}
