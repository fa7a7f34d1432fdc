import { describe, expect, it } from 'vitest';
import { TooManyRequestsBodySchema, tooManySignInAttemptsMessage } from './auth.contract.js';

describe('sign-in refusal for too many attempts', () => {
  it('says when to try again, rounded up so nobody comes back too early', () => {
    expect(tooManySignInAttemptsMessage(900)).toBe('Too many sign-in attempts. Try again in 15 minutes.');
    expect(tooManySignInAttemptsMessage(841)).toBe('Too many sign-in attempts. Try again in 15 minutes.');
    expect(tooManySignInAttemptsMessage(840)).toBe('Too many sign-in attempts. Try again in 14 minutes.');
    expect(tooManySignInAttemptsMessage(60)).toBe('Too many sign-in attempts. Try again in 1 minute.');
    expect(tooManySignInAttemptsMessage(59)).toBe('Too many sign-in attempts. Try again in 59 seconds.');
    expect(tooManySignInAttemptsMessage(0.2)).toBe('Too many sign-in attempts. Try again in 1 second.');
    expect(tooManySignInAttemptsMessage(0)).toBe('Too many sign-in attempts. Try again in 1 second.');
  });

  it('describes the 429 body: the error shape plus the seconds to wait', () => {
    const body = { statusCode: 429, error: 'Too Many Requests', message: tooManySignInAttemptsMessage(120), retryAfterS: 120 };
    expect(TooManyRequestsBodySchema.parse(body)).toEqual(body);
    expect(TooManyRequestsBodySchema.safeParse({ ...body, retryAfterS: 0 }).success).toBe(false);
    expect(TooManyRequestsBodySchema.safeParse({ ...body, statusCode: 401 }).success).toBe(false);
  });
});
