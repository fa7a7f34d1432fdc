/**
 * Sign-in rate limiting with @nestjs/throttler over the PostgreSQL storage: one counter per client
 * address and one per account (the normalised e-mail), both over the same window. Only
 * `POST /api/auth/login` uses it (through SignInThrottlerGuard); no other route is throttled.
 *
 * Every attempt is counted before the password is hashed, so a burst cannot slip past the limit
 * while hashes run; a sign-in that succeeds gives its hits back (forgiveSignIn), so the limits
 * count failed and refused attempts, and an office behind one address is not locked out by its
 * own members signing in.
 */
import { HttpException, HttpStatus, Injectable, type ExecutionContext } from '@nestjs/common';
import { ThrottlerGuard, type ThrottlerLimitDetail, type ThrottlerModuleOptions } from '@nestjs/throttler';
import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';
import { tooManySignInAttemptsMessage, type TooManyRequestsBody } from '@beamwright/link-core/contracts';
import type { AuthConfig } from '../config/auth.config.js';
import type { PostgresThrottlerStorage } from '../rate-limits/postgres-throttler.storage.js';
import { normaliseEmail } from '../users/normalise-email.js';

export const SIGN_IN_ADDRESS_THROTTLER = 'sign-in-address';
export const SIGN_IN_ACCOUNT_THROTTLER = 'sign-in-account';

/** The keys this request was counted under, so a successful sign-in can give them back. */
const COUNTED_KEYS = Symbol('signInThrottleKeys');
type CountedRequest = Request & { [COUNTED_KEYS]?: string[] };

function emailOf(request: Request): string | undefined {
  const email: unknown = (request.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' && email.trim() !== '' ? normaliseEmail(email) : undefined;
}

export function signInThrottlerOptions(config: AuthConfig, storage: PostgresThrottlerStorage): ThrottlerModuleOptions {
  const { attemptsPerAccount, attemptsPerAddress, windowMs } = config.signInLimits;
  return {
    storage,
    // Retry-After is set by the guard itself; the X-RateLimit-* headers would tell a guesser
    // exactly how many tries are left.
    setHeaders: false,
    // Same window: the throttler keeps this order, so an address over its limit is refused
    // before the account is counted (a sprayer from one address cannot lock out every account).
    throttlers: [
      // address: the package's tracker (request.ip, IPv6 grouped by /64); request.ip follows
      // express `trust proxy` (TRUST_PROXY_HOPS, 0 by default: the connection's address)
      { name: SIGN_IN_ADDRESS_THROTTLER, limit: attemptsPerAddress, ttl: windowMs },
      {
        name: SIGN_IN_ACCOUNT_THROTTLER,
        limit: attemptsPerAccount,
        ttl: windowMs,
        getTracker: (request) => emailOf(request as Request) ?? '',
        // a body without an e-mail is a 400 and names no account; the address still counts it
        skipIf: (context) => emailOf(context.switchToHttp().getRequest<Request>()) === undefined,
      },
    ],
  };
}

/** The guard of POST /api/auth/login: counts the attempt, or answers 429 with Retry-After. */
@Injectable()
export class SignInThrottlerGuard extends ThrottlerGuard {
  protected override generateKey(context: ExecutionContext, tracker: string, throttlerName: string): string {
    // hashed, so the table holds neither e-mails nor addresses
    const key = createHash('sha256').update(`${throttlerName}\n${tracker}`).digest('hex');
    const request = context.switchToHttp().getRequest<CountedRequest>();
    (request[COUNTED_KEYS] ??= []).push(key);
    return key;
  }

  protected override async throwThrottlingException(context: ExecutionContext, detail: ThrottlerLimitDetail): Promise<void> {
    const retryAfterS = Math.max(1, Math.ceil(detail.timeToBlockExpire));
    context.switchToHttp().getResponse<Response>().setHeader('Retry-After', String(retryAfterS));
    const body: Omit<TooManyRequestsBody, 'error'> = {
      statusCode: HttpStatus.TOO_MANY_REQUESTS,
      message: tooManySignInAttemptsMessage(retryAfterS),
      retryAfterS,
    };
    throw new HttpException(body, HttpStatus.TOO_MANY_REQUESTS);
  }
}

/** Gives back the hits of a sign-in that succeeded (see the file comment). */
export async function forgiveSignIn(request: Request, storage: PostgresThrottlerStorage): Promise<void> {
  for (const key of (request as CountedRequest)[COUNTED_KEYS] ?? []) await storage.forgive(key);
}
