import { registerAs } from '@nestjs/config';
import { resolve } from 'node:path';
import { EnvSchema } from './env.schema.js';
import { CHECKOUT_ROOT } from './checkout-paths.js';

export const appConfig = registerAs('app', () => {
  const env = EnvSchema.parse(process.env);
  return {
    nodeEnv: env.NODE_ENV,
    port: env.PORT,
    host: env.HOST,
    uiDistDir: env.UI_DIST_DIR ? resolve(env.UI_DIST_DIR) : resolve(CHECKOUT_ROOT, 'ui', 'dist'),
    demoPassword: env.DEMO_PASSWORD,
    hstsMaxAgeSeconds: env.HSTS_MAX_AGE_SECONDS,
    requestTimeoutMs: env.HTTP_REQUEST_TIMEOUT_SECONDS * 1000,
    trustProxyHops: env.TRUST_PROXY_HOPS,
  };
});
export type AppConfig = ReturnType<typeof appConfig>;
