import { registerAs } from '@nestjs/config';
import { EnvSchema, expiresInToSeconds } from './env.schema.js';

export const authConfig = registerAs('auth', () => {
  const env = EnvSchema.parse(process.env);
  return {
    jwtSecret: env.JWT_SECRET,
    jwtExpiresInS: expiresInToSeconds(env.JWT_EXPIRES_IN),
    signInLimits: {
      attemptsPerAccount: env.SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT,
      attemptsPerAddress: env.SIGN_IN_MAX_ATTEMPTS_PER_ADDRESS,
      windowMs: expiresInToSeconds(env.SIGN_IN_ATTEMPT_WINDOW) * 1000,
    },
  };
});
export type AuthConfig = ReturnType<typeof authConfig>;
