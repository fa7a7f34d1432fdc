/**
 * The environment the API accepts, checked once at boot: a missing or malformed setting stops the
 * process with a message naming the variable instead of failing later at first use.
 */
import { z } from 'zod';
// The one list of local defaults: this schema, the start and test scripts and .env.example all
// follow it (env-defaults.spec.ts checks that .env.example and the README agree).
import ENV_DEFAULTS from './env-defaults.json' with { type: 'json' };

export { ENV_DEFAULTS };
const defaultNumber = (name: keyof typeof ENV_DEFAULTS) => Number(ENV_DEFAULTS[name]);

const port = (fallback: number) => z.coerce.number().int().min(1).max(65_535).default(fallback);
const duration = (fallback: string) =>
  z
    .string()
    .regex(/^\d+[smhd]?$/, 'must be seconds or a number followed by s, m, h or d (e.g. 8h)')
    .default(fallback);
const attemptCount = (fallback: number) => z.coerce.number().int().min(1, 'must be at least 1').max(1_000_000).default(fallback);

export const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default(ENV_DEFAULTS.NODE_ENV as 'production'),
  PORT: port(defaultNumber('PORT')),
  HOST: z.string().min(1).default(ENV_DEFAULTS.HOST),
  DATABASE_HOST: z.string().min(1).default(ENV_DEFAULTS.DATABASE_HOST),
  DATABASE_PORT: port(defaultNumber('DATABASE_PORT')),
  DATABASE_USER: z.string().min(1).default(ENV_DEFAULTS.DATABASE_USER),
  DATABASE_PASSWORD: z.string().default(ENV_DEFAULTS.DATABASE_PASSWORD),
  DATABASE_NAME: z.string().min(1).default(ENV_DEFAULTS.DATABASE_NAME),
  /** HMAC secret of the access tokens; at least 16 characters so a placeholder cannot slip through */
  JWT_SECRET: z.string().min(16, 'must be at least 16 characters'),
  /** token lifetime: seconds, or a number with s/m/h/d (e.g. 8h) */
  JWT_EXPIRES_IN: duration(ENV_DEFAULTS.JWT_EXPIRES_IN),
  /** sign-in attempts one account may make per window (the e-mail, lower-cased and trimmed, is the key) */
  SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT: attemptCount(defaultNumber('SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT')),
  /** sign-in attempts one client address may make per window, whatever the accounts */
  SIGN_IN_MAX_ATTEMPTS_PER_ADDRESS: attemptCount(defaultNumber('SIGN_IN_MAX_ATTEMPTS_PER_ADDRESS')),
  /** the window of both limits, and how long a key stays refused once over its limit */
  SIGN_IN_ATTEMPT_WINDOW: duration(ENV_DEFAULTS.SIGN_IN_ATTEMPT_WINDOW),
  /**
   * proxies in front of the app whose X-Forwarded-For is believed (express `trust proxy` as a hop
   * count). 0, the default: the client address is the connection's, and the header is ignored.
   */
  TRUST_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(defaultNumber('TRUST_PROXY_HOPS')),
  DEMO_PASSWORD: z.string().min(8, 'must be at least 8 characters').default(ENV_DEFAULTS.DEMO_PASSWORD),
  /** Strict-Transport-Security max-age in seconds; 0 (the default) sends none: set it only behind TLS */
  HSTS_MAX_AGE_SECONDS: z.coerce.number().int().min(0).max(63_072_000).default(defaultNumber('HSTS_MAX_AGE_SECONDS')),
  /** a request whose headers and body have not all arrived within this many seconds is dropped */
  HTTP_REQUEST_TIMEOUT_SECONDS: z.coerce.number().min(1).max(600).default(defaultNumber('HTTP_REQUEST_TIMEOUT_SECONDS')),
  /**
   * how long POST /api/weather-datasets waits for its import to end before answering 202 with the
   * job to poll (0: always 202; a client may also ask with `Prefer: respond-async`)
   */
  WEATHER_IMPORT_WAIT_SECONDS: z.coerce.number().min(0).max(120).default(defaultNumber('WEATHER_IMPORT_WAIT_SECONDS')),
  /** a running import whose heartbeat is older than this is taken as stopped (its process died) and retried */
  WEATHER_IMPORT_STALL_SECONDS: z.coerce.number().min(2).max(3600).default(defaultNumber('WEATHER_IMPORT_STALL_SECONDS')),
  /** how often an interrupted import is run again before it is reported failed */
  WEATHER_IMPORT_RETRIES: z.coerce.number().int().min(0).max(10).default(defaultNumber('WEATHER_IMPORT_RETRIES')),
  /** folder of the built UI; defaults to <checkout>/ui/dist */
  UI_DIST_DIR: z.string().min(1).optional(),
});
export type Env = z.infer<typeof EnvSchema>;

/** Used by ConfigModule.forRoot({ validate }); throws one error listing every bad variable. */
export function validateEnv(raw: Record<string, unknown>): Env {
  const result = EnvSchema.safeParse(raw);
  if (!result.success) {
    const lines = result.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  return result.data;
}

/** Converts JWT_EXPIRES_IN to seconds (the same units jsonwebtoken accepts). */
export function expiresInToSeconds(value: string): number {
  const match = /^(\d+)([smhd]?)$/.exec(value);
  if (!match) throw new Error(`Invalid duration: ${value}`);
  const factor = { '': 1, s: 1, m: 60, h: 3600, d: 86_400 }[match[2] as '' | 's' | 'm' | 'h' | 'd'];
  return Number(match[1]) * factor;
}
