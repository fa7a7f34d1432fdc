/**
 * `npm run seed -w @beamwright/api`: seeds the fictional demo scenario into the database named by
 * DATABASE_* (and the checkout's .env). Safe to run again: nothing is duplicated.
 */
import 'reflect-metadata';
import { loadCheckoutEnvFile } from '../../config/checkout-paths.js';
import { EnvSchema } from '../../config/env.schema.js';
import { typeOrmOptions } from '../typeorm-options.js';
import { DataSource } from 'typeorm';
import { seedDemo } from './demo-seed.js';

loadCheckoutEnvFile();
const env = EnvSchema.omit({ JWT_SECRET: true }).parse(process.env);
const dataSource = new DataSource(
  typeOrmOptions({
    host: env.DATABASE_HOST,
    port: env.DATABASE_PORT,
    username: env.DATABASE_USER,
    password: env.DATABASE_PASSWORD,
    database: env.DATABASE_NAME,
  }),
);

try {
  await dataSource.initialize();
  const summary = await seedDemo(dataSource, { demoPassword: env.DEMO_PASSWORD });
  console.log(
    `Demo seeded (organisation ${summary.organisationId}): created ${summary.usersCreated} users, ${summary.sitesCreated} sites, ${summary.equipmentCreated} equipment models, ${summary.linksCreated} links, ${summary.weatherDatasetsCreated} weather data sets (invented); updated ${summary.usersUpdated} users`,
  );
} catch (error) {
  console.error(`Seeding failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = 1;
} finally {
  if (dataSource.isInitialized) await dataSource.destroy();
}
