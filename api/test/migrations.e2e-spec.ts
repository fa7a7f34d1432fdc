import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../src/database/migrations/index.js';
import { typeOrmOptions } from '../src/database/typeorm-options.js';
import { startThrowawayPostgres, type ThrowawayPostgres } from './utils/throwaway-postgres.js';

/** Tables, columns, constraints, indexes and enum types of the public schema, as comparable text. */
async function schemaSnapshot(dataSource: DataSource): Promise<string[]> {
  const rows = (await dataSource.query(`
    SELECT 'column ' || table_name || '.' || column_name || ' ' || data_type || ' ' || is_nullable || ' ' || coalesce(column_default, '') AS line
      FROM information_schema.columns WHERE table_schema = 'public'
    UNION ALL
    SELECT 'constraint ' || conrelid::regclass || ' ' || conname || ' ' || pg_get_constraintdef(oid)
      FROM pg_constraint WHERE connamespace = 'public'::regnamespace
    UNION ALL
    SELECT 'index ' || indexname || ' ' || indexdef FROM pg_indexes WHERE schemaname = 'public'
    UNION ALL
    SELECT 'type ' || t.typname || ' ' || string_agg(e.enumlabel, ',' ORDER BY e.enumsortorder)
      FROM pg_type t JOIN pg_enum e ON e.enumtypid = t.oid WHERE t.typnamespace = 'public'::regnamespace GROUP BY t.typname
  `)) as { line: string }[];
  return rows.map((row) => row.line).filter((line) => !line.includes('typeorm_migrations')).sort();
}

/**
 * Every migration up, every one down again, and up once more, on a private cluster: each `down`
 * undoes its `up` completely, and the schema the migrations build is the one the entities describe.
 */
describe('database migrations (e2e, private database)', () => {
  let database: ThrowawayPostgres;
  let dataSource: DataSource;

  beforeAll(async () => {
    database = await startThrowawayPostgres({ label: 'api-migrations' });
    dataSource = new DataSource(
      typeOrmOptions({ host: database.host, port: database.port, username: database.user, password: database.password, database: database.database }),
    );
    await dataSource.initialize();
  });

  afterAll(async () => {
    await dataSource?.destroy();
    await database?.remove();
  });

  it('runs up, down and up again to the same schema, which matches the entities', async () => {
    const applied = await dataSource.runMigrations({ transaction: 'all' });
    expect(applied.map((migration) => migration.name)).toEqual(MIGRATIONS.map((migration) => migration.name));
    const afterFirstUp = await schemaSnapshot(dataSource);
    expect(afterFirstUp.some((line) => line.startsWith('column link_revision.'))).toBe(true);
    // the entities need no change the migrations have not made (a forgotten migration shows here)
    expect((await dataSource.driver.createSchemaBuilder().log()).upQueries.map((query) => query.query)).toEqual([]);

    for (let step = 0; step < MIGRATIONS.length; step += 1) await dataSource.undoLastMigration({ transaction: 'all' });
    expect(await schemaSnapshot(dataSource)).toEqual([]);
    expect(await dataSource.query('SELECT count(*)::int AS n FROM typeorm_migrations')).toEqual([{ n: 0 }]);

    await dataSource.runMigrations({ transaction: 'all' });
    expect(await schemaSnapshot(dataSource)).toEqual(afterFirstUp);
  });
});
