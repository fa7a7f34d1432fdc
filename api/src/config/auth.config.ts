import { registerAs } from '@nestjs/config';
import { EnvSchema, expiresInToSeconds } from './env.schema.js';

export const authConfig = registerAs('auth', () => {
  const env = EnvSchema.parse(process.env);
  return {
    jwtSecret: env.JWT_SECRET,
    jwtExpiresInS: expiresInToSeconds(env.JWT_EXPIRES_IN),
  };
});
export type AuthConfig = ReturnType<typeof authConfig>;
