import { afterEach, describe, expect, it, vi } from 'vitest';
import { api, isApiError, parseRetryAfter } from '@/lib/api-client';
import { mockApi } from '@/testing/test-utils';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('Retry-After', () => {
  it('reads the delay in seconds and the HTTP-date form (RFC 9110 §10.2.3)', () => {
    expect(parseRetryAfter('120')).toBe(120);
    expect(parseRetryAfter(' 0 ')).toBe(0);
    const nowMs = Date.parse('2026-12-03T14:00:00Z');
    expect(parseRetryAfter('Thu, 03 Dec 2026 14:15:00 GMT', nowMs)).toBe(900);
    expect(parseRetryAfter('Thu, 03 Dec 2026 13:00:00 GMT', nowMs)).toBe(0);
    expect(parseRetryAfter(null)).toBeNull();
    expect(parseRetryAfter('soon')).toBeNull();
  });

  it('travels on the ApiError of a refused call', async () => {
    mockApi([{ method: 'POST', path: '/auth/login', status: 429, headers: { 'Retry-After': '300' }, body: { statusCode: 429, error: 'Too Many Requests', message: 'wait' } }]);
    const error = await api.post('/auth/login', { email: 'a@b.test', password: 'x' }, { authenticated: false }).catch((caught: unknown) => caught);
    expect(isApiError(error, 429)).toBe(true);
    expect((error as { retryAfterS: number | null }).retryAfterS).toBe(300);
  });
});
