import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { typeOrmOptions, type DatabaseConnectionSettings } from '../../src/database/typeorm-options.js';

/** Runs every pending migration against the database (the same list the app and CLI use). */
export async function runMigrations(settings: DatabaseConnectionSettings): Promise<void> {
  const dataSource = new DataSource(typeOrmOptions(settings));
  await dataSource.initialize();
  try {
    await dataSource.runMigrations({ transaction: 'all' });
  } finally {
    await dataSource.destroy();
  }
}
