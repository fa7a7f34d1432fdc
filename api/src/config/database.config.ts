import { registerAs } from '@nestjs/config';
import { EnvSchema } from './env.schema.js';

export const databaseConfig = registerAs('database', () => {
  const env = EnvSchema.parse(process.env);
  return {
    host: env.DATABASE_HOST,
    port: env.DATABASE_PORT,
    username: env.DATABASE_USER,
    password: env.DATABASE_PASSWORD,
    database: env.DATABASE_NAME,
  };
});
export type DatabaseConfig = ReturnType<typeof databaseConfig>;
