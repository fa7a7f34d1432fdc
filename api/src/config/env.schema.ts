/**
 * The environment the API accepts, checked once at boot: a missing or malformed setting stops the
 * process with a message naming the variable instead of failing later at first use.
 */
import { z } from 'zod';

const port = (fallback: number) => z.coerce.number().int().min(1).max(65_535).default(fallback);
const duration = (fallback: string) =>
  z
    .string()
    .regex(/^\d+[smhd]?$/, 'must be seconds or a number followed by s, m, h or d (e.g. 8h)')
    .default(fallback);
const attemptCount = (fallback: number) => z.coerce.number().int().min(1, 'must be at least 1').max(1_000_000).default(fallback);

export const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: port(3000),
  HOST: z.string().min(1).default('127.0.0.1'),
  DATABASE_HOST: z.string().min(1).default('127.0.0.1'),
  DATABASE_PORT: port(54329),
  DATABASE_USER: z.string().min(1).default('beamwright'),
  DATABASE_PASSWORD: z.string().default('beamwright-local'),
  DATABASE_NAME: z.string().min(1).default('beamwright'),
  /** HMAC secret of the access tokens; at least 16 characters so a placeholder cannot slip through */
  JWT_SECRET: z.string().min(16, 'must be at least 16 characters'),
  /** token lifetime: seconds, or a number with s/m/h/d (e.g. 8h) */
  JWT_EXPIRES_IN: duration('8h'),
  /** sign-in attempts one account may make per window (the e-mail, lower-cased and trimmed, is the key) */
  SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT: attemptCount(5),
  /** sign-in attempts one client address may make per window, whatever the accounts */
  SIGN_IN_MAX_ATTEMPTS_PER_ADDRESS: attemptCount(30),
  /** the window of both limits, and how long a key stays refused once over its limit */
  SIGN_IN_ATTEMPT_WINDOW: duration('15m'),
  /**
   * proxies in front of the app whose X-Forwarded-For is believed (express `trust proxy` as a hop
   * count). 0, the default: the client address is the connection's, and the header is ignored.
   */
  TRUST_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
  DEMO_PASSWORD: z.string().min(8, 'must be at least 8 characters').default('demo-pass-2026'),
  /** Strict-Transport-Security max-age in seconds; 0 (the default) sends none: set it only behind TLS */
  HSTS_MAX_AGE_SECONDS: z.coerce.number().int().min(0).max(63_072_000).default(0),
  /** a request whose headers and body have not all arrived within this many seconds is dropped */
  HTTP_REQUEST_TIMEOUT_SECONDS: z.coerce.number().min(1).max(600).default(30),
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
