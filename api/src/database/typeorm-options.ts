import type { DataSourceOptions } from 'typeorm';
import { ENTITIES } from './entities.js';
import { MIGRATIONS } from './migrations/index.js';

export interface DatabaseConnectionSettings {
  host: string;
  port: number;
  username: string;
  password: string;
  database: string;
}

/**
 * Options shared by the app (TypeOrmModule), the CLI data source and the tests. Schema changes go
 * through migrations only: synchronize stays off everywhere.
 */
export function typeOrmOptions(settings: DatabaseConnectionSettings): DataSourceOptions {
  return {
    type: 'postgres',
    ...settings,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsTableName: 'typeorm_migrations',
    migrationsTransactionMode: 'all',
    synchronize: false,
    // gen_random_uuid() is built into PostgreSQL 13+: no extension (and no superuser) needed
    uuidExtension: 'pgcrypto',
    installExtensions: false,
    extra: {
      max: 10,
      // fail fast when the database is stopped, so /api/health can say "down" quickly
      connectionTimeoutMillis: 2000,
    },
  };
}
