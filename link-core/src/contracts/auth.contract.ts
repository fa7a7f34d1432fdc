/** Sign-in and the signed-in user. */
import { z } from 'zod';
import { ErrorBodySchema } from './error.contract.js';

/**
 * One role per user: `admin` manages members, settings and the reference data (sites, equipment),
 * `engineer` creates, edits and submits designs, `reviewer` approves or returns them, `installer`
 * reads designs and link sheets and records the installation. Who may do each action is the table
 * PERMISSIONS in workflow-rules.ts.
 */
export const ROLES = ['admin', 'engineer', 'reviewer', 'installer'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

/** A string field whose absence reads "is required" (not zod's generic type message). */
export function requiredString() {
  return z.string({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be text') });
}

export const LoginRequestSchema = z.strictObject({
  email: requiredString().trim().min(1, 'is required').max(320, 'must be at most 320 characters').email('must be an e-mail address'),
  password: requiredString().min(1, 'is required').max(1024, 'must be at most 1024 characters'),
});
export type LoginRequest = z.infer<typeof LoginRequestSchema>;

export const LoginResponseSchema = z.object({
  /** JWT to send as `Authorization: Bearer <token>` */
  accessToken: z.string(),
  /** seconds until the token expires */
  expiresInS: z.number().int().positive(),
});
export type LoginResponse = z.infer<typeof LoginResponseSchema>;

export const UserRefSchema = z.object({
  id: z.uuid(),
  displayName: z.string(),
});
export type UserRef = z.infer<typeof UserRefSchema>;

export const MeResponseSchema = z.object({
  user: z.object({ id: z.uuid(), email: z.string(), displayName: z.string() }),
  organisation: z.object({ id: z.uuid(), name: z.string() }),
  role: RoleSchema,
});
export type MeResponse = z.infer<typeof MeResponseSchema>;

/**
 * 429 from `POST /api/auth/login` when an account or a client address has used up its sign-in
 * attempts. The same number of seconds travels in the `Retry-After` header.
 */
export const TooManyRequestsBodySchema = ErrorBodySchema.extend({
  statusCode: z.literal(429),
  /** seconds until sign-in is accepted again (equals the Retry-After header) */
  retryAfterS: z.number().int().positive(),
});
export type TooManyRequestsBody = z.infer<typeof TooManyRequestsBodySchema>;

/**
 * The sentence the api answers and the ui shows when sign-in is refused for too many attempts,
 * rounded up to whole minutes from one minute on, so nobody is told to come back too early.
 * @param retryAfterS seconds until sign-in is accepted again (≥ 0)
 */
export function tooManySignInAttemptsMessage(retryAfterS: number): string {
  const seconds = Math.max(1, Math.ceil(retryAfterS));
  if (seconds < 60) return `Too many sign-in attempts. Try again in ${seconds} ${seconds === 1 ? 'second' : 'seconds'}.`;
  const minutes = Math.ceil(seconds / 60);
  return `Too many sign-in attempts. Try again in ${minutes} ${minutes === 1 ? 'minute' : 'minutes'}.`;
}
