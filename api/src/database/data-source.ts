/**
 * Data source for the TypeORM CLI (migration:generate on the source through tsx, migration:run
 * on the build). Reads the same DATABASE_* variables as the app, and the checkout's .env.
 */
import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadCheckoutEnvFile } from '../config/checkout-paths.js';
import { EnvSchema } from '../config/env.schema.js';
import { typeOrmOptions } from './typeorm-options.js';

loadCheckoutEnvFile();
const env = EnvSchema.pick({
  DATABASE_HOST: true,
  DATABASE_PORT: true,
  DATABASE_USER: true,
  DATABASE_PASSWORD: true,
  DATABASE_NAME: true,
}).parse(process.env);

export default new DataSource(
  typeOrmOptions({
    host: env.DATABASE_HOST,
    port: env.DATABASE_PORT,
    username: env.DATABASE_USER,
    password: env.DATABASE_PASSWORD,
    database: env.DATABASE_NAME,
  }),
);
