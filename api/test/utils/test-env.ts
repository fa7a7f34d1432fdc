/**
 * Settings the e2e tests run with. The database comes from DATABASE_* (the root `npm test` points
 * them at its throwaway cluster); the secret is a test-only value unless one is given.
 */
export function applyTestEnv(): void {
  process.env.NODE_ENV ??= 'test';
  process.env.JWT_SECRET ??= 'test-only-secret-not-for-production';
  process.env.JWT_EXPIRES_IN ??= '15m';
  // Every e2e file signs in from one address (loopback) and shares one database, so the sign-in
  // limits are set out of reach here; test/sign-in-rate-limit.e2e-spec.ts sets small ones.
  process.env.SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT ??= '10000';
  process.env.SIGN_IN_MAX_ATTEMPTS_PER_ADDRESS ??= '10000';
  // The e2e tests do not need the built UI; an empty folder keeps them independent of it.
  process.env.UI_DIST_DIR ??= '/nonexistent/beamwright-ui-dist';
}

export function databaseSettingsFromEnv() {
  return {
    host: process.env.DATABASE_HOST ?? '127.0.0.1',
    port: Number(process.env.DATABASE_PORT ?? 54329),
    username: process.env.DATABASE_USER ?? 'beamwright',
    password: process.env.DATABASE_PASSWORD ?? 'beamwright-local',
    database: process.env.DATABASE_NAME ?? 'beamwright',
  };
}
