/**
 * `npm run migration:run -w @beamwright/api`: applies pending migrations to the database named by
 * DATABASE_* (and the checkout's .env), all in one transaction, and prints one line per migration.
 * Same data source as the TypeORM CLI (`npm run typeorm -- migration:show -d dist/database/data-source.js`),
 * without the CLI's echo of every SQL statement.
 */
import 'reflect-metadata';
import dataSource from './data-source.js';

try {
  await dataSource.initialize();
  const applied = await dataSource.runMigrations({ transaction: 'all' });
  if (applied.length === 0) console.log('Database schema is up to date (no pending migrations)');
  for (const migration of applied) console.log(`Applied migration ${migration.name}`);
} catch (error) {
  console.error(`Migrations failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = 1;
} finally {
  if (dataSource.isInitialized) await dataSource.destroy();
}
